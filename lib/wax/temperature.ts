import { celsiusToFahrenheit } from "@/lib/units";
import { WaxInputError, type WaxIssue, type WaxWarning } from "./errors";
import { FLASH_POINT_MARGIN_C, FUME_WARNING_ABOVE_C } from "./limits";

/** What the temperature rules need of a material. */
export interface HeatFigures {
  id: string;
  name: string;
  flashPointC: number | null;
  discoloursAboveC?: number | null;
  meltingRangeC?: { fromC: number; toC: number };
}

export interface WorkingRangeC {
  minC: number;
  maxC: number;
}

/** ok: the rule holds; tooNear: refused; unknown: a material's flash point is not known, so the rule cannot be checked. */
export type FlashPointStatus = "ok" | "tooNear" | "unknown";

export interface TemperatureCheck {
  status: FlashPointStatus;
  /** Working max above 100 °C (212 °F): fumes rise quickly. */
  fumeWarning: boolean;
  /** The lowest known flash point of the mix and its material; null when none is known. */
  lowestFlashPoint: { materialId: string; name: string; flashPointC: number } | null;
  /** Lowest known flash point − working max, °C. */
  marginC: number | null;
  /** The working max must stay below this: lowest known flash point − 50 °C. */
  limitC: number | null;
  unknownFlashPoint: { materialId: string; name: string }[];
  /** The refusal (tooNear) or the reason the rule cannot be checked (unknown); null when ok. */
  problem: WaxIssue | null;
  /** Cautions that do not refuse: fumes, discolouring, a range below every melting start. */
  warnings: WaxWarning[];
}

const MAX_FIELD = "workingRangeC.maxC";

/** A working range in °F, by °F = °C × 9/5 + 32 (NIST SP 811). */
export function workingRangeF(range: WorkingRangeC): { minF: number; maxF: number } {
  return { minF: celsiusToFahrenheit(range.minC), maxF: celsiusToFahrenheit(range.maxC) };
}

/**
 * Temperature rules for a working range (°C) and the mix's materials (SPEC 5.3): a max above 100 °C warns of
 * fumes; a max within 50 °C of the lowest flash point (flash − max ≤ 50, the boundary counts as within) is
 * refused; a material with no known flash point means the rule cannot be checked (unless a known one already
 * refuses). Also warns where a material discolours (beeswax above about 85 °C) and where the max lies below
 * every component's melting start.
 */
export function checkTemperature(range: WorkingRangeC, materials: readonly HeatFigures[]): TemperatureCheck {
  const warnings: WaxWarning[] = [];
  const fumeWarning = range.maxC > FUME_WARNING_ABOVE_C;
  if (fumeWarning) {
    warnings.push({
      field: MAX_FIELD,
      code: "wax.fumes",
      params: { maxC: range.maxC, aboveC: FUME_WARNING_ABOVE_C, aboveF: celsiusToFahrenheit(FUME_WARNING_ABOVE_C) },
    });
  }
  for (const m of materials) {
    if (m.discoloursAboveC != null && range.maxC > m.discoloursAboveC) {
      warnings.push({ field: MAX_FIELD, code: "wax.discolours", params: { material: m.name, aboveC: m.discoloursAboveC } });
    }
  }
  const melts = materials.flatMap((m) => (m.meltingRangeC ? [m.meltingRangeC.fromC] : []));
  if (melts.length > 0 && range.maxC < Math.min(...melts)) {
    warnings.push({ field: MAX_FIELD, code: "wax.belowMelting", params: { maxC: range.maxC, fromC: Math.min(...melts) } });
  }

  const unknownFlashPoint = materials.filter((m) => m.flashPointC === null).map((m) => ({ materialId: m.id, name: m.name }));
  let lowest: TemperatureCheck["lowestFlashPoint"] = null;
  for (const m of materials) {
    if (m.flashPointC !== null && (lowest === null || m.flashPointC < lowest.flashPointC)) {
      lowest = { materialId: m.id, name: m.name, flashPointC: m.flashPointC };
    }
  }
  const marginC = lowest ? lowest.flashPointC - range.maxC : null;
  const limitC = lowest ? lowest.flashPointC - FLASH_POINT_MARGIN_C : null;

  let status: FlashPointStatus = "ok";
  let problem: WaxIssue | null = null;
  if (lowest && marginC !== null && marginC <= FLASH_POINT_MARGIN_C) {
    status = "tooNear";
    problem = {
      field: MAX_FIELD,
      code: "wax.tooNearFlashPoint",
      params: {
        material: lowest.name,
        flashPointC: lowest.flashPointC,
        maxC: range.maxC,
        marginC,
        minMarginC: FLASH_POINT_MARGIN_C,
        limitC: limitC ?? 0,
      },
    };
  } else if (unknownFlashPoint.length > 0) {
    status = "unknown";
    problem = {
      field: MAX_FIELD,
      code: "wax.flashPointUnknown",
      params: { materials: unknownFlashPoint.map((m) => m.name).join(", ") },
    };
  }
  return { status, fumeWarning, lowestFlashPoint: lowest, marginC, limitC, unknownFlashPoint, problem, warnings };
}

/** Throws the refusal of a working range too near a flash point (WaxInputError on workingRangeC.maxC); else returns. */
export function assertTemperatureAllowed(check: TemperatureCheck): void {
  if (check.status === "tooNear" && check.problem) throw new WaxInputError([check.problem]);
}
