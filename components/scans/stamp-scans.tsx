import { getTranslations } from "next-intl/server";
import { Panel } from "@/components/ui/panel";
import type { ScansAnswer } from "@/lib/contracts/scans";
import type { UnitSystem } from "@/lib/stamps/format";
import { ScansPanel } from "./scans-panel";

interface Props {
  code: string;
  coverageRatio: number | null;
  hasOutline: boolean;
  canWrite: boolean;
  unitSystem: UnitSystem;
  /** The first list, loaded by the page on the server; the client keeps it fresh. */
  initial: ScansAnswer;
}

/** The scans panel of a stamp record page. */
export async function StampScans(props: Props) {
  const t = await getTranslations("scans.panel");
  return (
    <Panel title={t("title")} intro={t("intro")}>
      <ScansPanel
        code={props.code}
        canWrite={props.canWrite}
        unitSystem={props.unitSystem}
        stampCoverage={props.coverageRatio}
        hasOutline={props.hasOutline}
        initial={props.initial}
      />
    </Panel>
  );
}
