/** Millimetres per inch, exact by definition (NIST SP 811). */
export const MM_PER_INCH = 25.4;

/** Above this deviation from the stamp's record the keeper is warned. */
export const SIZE_WARN_PCT = 3;

export interface SizeMm {
  widthMm: number;
  heightMm: number;
}

/** Physical size of a scan: mm = px / dpi × 25.4. Assumes the same resolution across and down. */
export function physicalSizeMm(widthPx: number, heightPx: number, dpi: number): SizeMm {
  if (!(dpi > 0)) throw new RangeError(`dpi must be positive, got ${dpi}`);
  return { widthMm: (widthPx / dpi) * MM_PER_INCH, heightMm: (heightPx / dpi) * MM_PER_INCH };
}

/** The resolution at which `px` pixels span `mm` millimetres: dpi = px / mm × 25.4 (to offer when a file has none). */
export function impliedDpi(px: number, mm: number): number {
  if (!(mm > 0)) throw new RangeError(`mm must be positive, got ${mm}`);
  return (px / mm) * MM_PER_INCH;
}

export interface SizeComparison {
  measured: SizeMm;
  recorded: SizeMm;
  /** Whether the scan lies turned by 90° against the record (width ↔ height), chosen when that fits better. */
  turned: boolean;
  /** (measured − recorded) / recorded × 100, signed, after turning when `turned`. */
  widthDeviationPct: number;
  heightDeviationPct: number;
  /** The larger of the two absolute deviations. */
  maxDeviationPct: number;
  /** maxDeviationPct > tolerancePct. */
  warn: boolean;
  tolerancePct: number;
}

/**
 * Compares a scan's measured size with the stamp's recorded footprint. deviation % = (measured − recorded) /
 * recorded × 100 per side; warns when either side is off by more than `tolerancePct` (default 3 %). A scan
 * made with the stamp turned a quarter is compared turned, whichever orientation fits better.
 */
export function compareWithRecord(measured: SizeMm, recorded: SizeMm, tolerancePct = SIZE_WARN_PCT): SizeComparison {
  if (!(recorded.widthMm > 0 && recorded.heightMm > 0)) throw new RangeError("recorded size must be positive");
  const deviation = (m: number, r: number) => ((m - r) / r) * 100;
  const straight = [deviation(measured.widthMm, recorded.widthMm), deviation(measured.heightMm, recorded.heightMm)];
  const turned = [deviation(measured.heightMm, recorded.widthMm), deviation(measured.widthMm, recorded.heightMm)];
  const worst = (d: number[]) => Math.max(Math.abs(d[0]), Math.abs(d[1]));
  const useTurned = worst(turned) < worst(straight);
  const [widthDeviationPct, heightDeviationPct] = useTurned ? turned : straight;
  const maxDeviationPct = Math.max(Math.abs(widthDeviationPct), Math.abs(heightDeviationPct));
  return {
    measured,
    recorded,
    turned: useTurned,
    widthDeviationPct,
    heightDeviationPct,
    maxDeviationPct,
    // The margin keeps float rounding (185.4 mm against 180 mm is 3.0000000000000027 %) from deciding a boundary case.
    warn: maxDeviationPct > tolerancePct + 1e-9,
    tolerancePct,
  };
}
