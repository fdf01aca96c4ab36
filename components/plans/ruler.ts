import { mmToInches } from "@/lib/units";
import type { UnitSystem } from "@/lib/stamps/format";

// Tick marks of the picture's rulers in the person's units: millimetres labelled in cm (or m), or inches labelled in
// in (or yd past a yard). Pure: the picture draws what this returns.

export interface Tick {
  atMm: number;
  /** The label of a major tick, e.g. "40 cm" or "18 in"; minor ticks have none. */
  label?: string;
  major: boolean;
}

type FormatNumber = (value: number, options?: { maximumFractionDigits?: number }) => string;

const METRIC_STEPS_MM = [10, 20, 50, 100, 200, 500, 1000, 2000, 5000];
const IMPERIAL_STEPS_IN = [0.5, 1, 2, 3, 6, 12, 18, 36, 72, 180];

/** Ticks from startMm to endMm with about `majors` labelled ones (and four minor ticks between labels where they fit). */
export function rulerTicks(startMm: number, endMm: number, system: UnitSystem, format: FormatNumber, majors = 8): Tick[] {
  const span = endMm - startMm;
  if (!(span > 0)) return [];
  const imperial = system === "imperial";
  const steps = imperial ? IMPERIAL_STEPS_IN.map((s) => s * 25.4) : METRIC_STEPS_MM;
  const major = steps.find((s) => span / s <= majors) ?? steps[steps.length - 1];
  const minor = major / (imperial && major >= 25.4 * 12 ? 4 : 5);
  const label = (mm: number) => {
    if (imperial) {
      const inches = mmToInches(mm);
      return inches >= 36 && major >= 914.4 ? `${format(inches / 36, { maximumFractionDigits: 2 })} yd` : `${format(inches, { maximumFractionDigits: 1 })} in`;
    }
    return major >= 1000 ? `${format(mm / 1000, { maximumFractionDigits: 1 })} m` : `${format(mm / 10, { maximumFractionDigits: 1 })} cm`;
  };
  const ticks: Tick[] = [];
  const first = Math.ceil((startMm - 1e-9) / minor);
  for (let k = first; k * minor <= endMm + 1e-9 && ticks.length < 400; k++) {
    const at = k * minor;
    const isMajor = Math.abs(at / major - Math.round(at / major)) < 1e-6;
    ticks.push({ atMm: at, major: isMajor, ...(isMajor ? { label: label(at) } : {}) });
  }
  return ticks;
}
