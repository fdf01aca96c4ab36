import { getTranslations } from "next-intl/server";
import { Panel } from "@/components/ui/panel";
import type { ScansAnswer } from "@/lib/contracts/scans";
import type { UnitSystem } from "@/lib/stamps/format";
import { ScansPanel } from "./scans-panel";

/** The scans panel of a stamp record page: the page loads the first list on the server, then the client keeps it fresh. */
export async function StampScans(props: { code: string; coverageRatio: number | null; canWrite: boolean; unitSystem: UnitSystem; initial: ScansAnswer }) {
  const t = await getTranslations("scans.panel");
  return (
    <Panel title={t("title")} intro={t("intro")}>
      <ScansPanel code={props.code} canWrite={props.canWrite} unitSystem={props.unitSystem} stampCoverage={props.coverageRatio} initial={props.initial} />
    </Panel>
  );
}
