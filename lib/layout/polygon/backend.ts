/**
 * The one polygon operation the layout engine's hot path needs: the area of the non-zero union of many closed
 * rings on an integer grid. Each ring is a flat [x0, y0, x1, y1, …] array of integers (CLIPPER_UNITS_PER_MM
 * per mm); the answer is in grid units², never negative. Rings of one impression all wind the same way, so
 * "non-zero" unites overlapping impressions and keeps their holes.
 */
export interface PolygonBackend {
  readonly name: string;
  unionArea(rings: readonly Float64Array[]): number;
}
