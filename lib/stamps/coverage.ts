/**
 * Coverage is the share of a stamp's footprint that carries wax, stored as a ratio 0–1 and shown in %.
 * Below 1 % a stamp would hardly print: such a value is almost always a ratio typed into a percent field
 * (0.35 meant as 35 %), so forms ask before saving it and the shelf lists the stamps that have one. Pure.
 */
export const LOW_COVERAGE_RATIO = 0.01;

export const isLowCoverage = (ratio: number | null | undefined): ratio is number => typeof ratio === "number" && ratio < LOW_COVERAGE_RATIO;

/** Ratio → percent for a form field, without float noise (0.35 → 35, 0.0035 → 0.35). */
export const ratioToPercent = (ratio: number) => Number((ratio * 100).toFixed(2));
