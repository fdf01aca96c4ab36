import "server-only";
import { assertCan, type Actor } from "@/lib/authz";
import type { WaxDefaultsDto } from "@/lib/contracts/wax";
import type { UpdateWaxDefaultsInput } from "@/lib/validation/settings";
import { measuredRecoveryFigures } from "../runs/records";
import { currentSettings, saveSettings } from "../settings";

// The wax master's defaults for new estimates (rate before any calibration, losses, recovery after the boil-off),
// kept with the workshop settings (same row, version and history) but written by wax masters, not only admins.

export async function getWaxDefaults(actor: Actor): Promise<WaxDefaultsDto> {
  assertCan(actor, "data:read");
  const [{ settings, version }, measured] = await Promise.all([currentSettings(), measuredRecoveryFigures()]);
  return {
    waxRateGPerM2: settings.waxRateGPerM2,
    waxLossPct: settings.waxLossPct,
    waxRecoveryPct: settings.waxRecoveryPct,
    measuredRecoveryPct: measured?.pct ?? null,
    measuredRecoveryBoilOffs: measured?.boilOffs ?? 0,
    currency: settings.currency,
    version,
  };
}

/** Saves the defaults named, from the settings' version (409 settingsConflict on a stale one). */
export async function updateWaxDefaults(actor: Actor, input: UpdateWaxDefaultsInput): Promise<WaxDefaultsDto> {
  assertCan(actor, "wax:write");
  const { version, ...patch } = input;
  await saveSettings(actor, version, patch);
  return getWaxDefaults(actor);
}
