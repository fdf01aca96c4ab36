import type { RunSizeDto } from "@/lib/contracts/runs";
import type { Measures } from "@/lib/i18n/measures";
import { M_PER_YARD } from "@/lib/units";
import type { UnitSystem } from "@/lib/stamps/format";

type Translate = (key: "runs.size.metres" | "runs.size.yards" | "runs.size.pieces", values: Record<string, string | number>) => string;

/** A run's length in the person's units (metres, or yards for imperial people). */
export function runLengthText(t: Translate, metres: number, unitSystem: UnitSystem): string {
  return unitSystem === "imperial" ? t("runs.size.yards", { yards: metres / M_PER_YARD }) : t("runs.size.metres", { metres });
}

/** "30 m", or "40 pieces of 2,500 mm" for a run in pieces. */
export function runSizeText(t: Translate, m: Measures, size: RunSizeDto, unitSystem: UnitSystem): string {
  if (size.pieces && size.pieceLengthMm) return t("runs.size.pieces", { pieces: size.pieces, length: m.length(size.pieceLengthMm) });
  return runLengthText(t, size.totalMetres, unitSystem);
}
