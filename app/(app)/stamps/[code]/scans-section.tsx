import { StampScans } from "@/components/scans/stamp-scans";
import type { Actor } from "@/lib/authz";
import { listScans, scanLimits } from "@/lib/data/scans";
import { can } from "@/lib/permissions";

/** Loads a stamp's scans for its record page; streamed below the lookup, so an unknown code has answered 404 first. */
export async function ScansSection({ actor, code, coverageRatio, hasOutline }: { actor: Actor; code: string; coverageRatio: number | null; hasOutline: boolean }) {
  const scans = await listScans(actor, code);
  const { maxBytes, maxPixels } = scanLimits();
  return (
    <StampScans
      code={code}
      coverageRatio={coverageRatio}
      hasOutline={hasOutline}
      canWrite={can(actor.role, "stamps:write")}
      unitSystem={actor.unitSystem}
      initial={{ scans, limits: { maxBytes, maxPixels } }}
    />
  );
}
