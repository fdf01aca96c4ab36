import { getTranslations } from "next-intl/server";
import { Panel } from "@/components/ui/panel";
import type { Actor } from "@/lib/authz";
import { listScans, scanLimits } from "@/lib/data/scans";
import { can } from "@/lib/permissions";
import { ScansPanel } from "./scans-panel";

/** The scans panel of a stamp record page: loads the first list on the server, then the client keeps it fresh. */
export async function StampScans({ actor, code, coverageRatio, hasOutline }: { actor: Actor; code: string; coverageRatio: number | null; hasOutline: boolean }) {
  const t = await getTranslations("scans.panel");
  const [scans, { maxBytes, maxPixels }] = [await listScans(actor, code), scanLimits()];
  return (
    <Panel title={t("title")} intro={t("intro")}>
      <ScansPanel code={code} canWrite={can(actor.role, "stamps:write")} unitSystem={actor.unitSystem} stampCoverage={coverageRatio} hasOutline={hasOutline} initial={{ scans, limits: { maxBytes, maxPixels } }} />
    </Panel>
  );
}
