/** Bounds and tolerances of the layout engine, shared with the request schema (lib/validation/layout.ts). All lengths in mm. */

export const STAMP_SIDE_MIN_MM = 5;
export const STAMP_SIDE_MAX_MM = 1000;
export const CLOTH_WIDTH_MIN_MM = 10;
export const CLOTH_WIDTH_MAX_MM = 5000;
export const RUN_LENGTH_MIN_MM = 10;
/** 2 km: longer runs are refused as a likely unit mistake. */
export const RUN_LENGTH_MAX_MM = 2_000_000;
export const PIECES_MAX = 10_000;
export const GAP_MAX_MM = 1000;
/** A negative gap may overlap neighbours, but the repeat must still advance by at least this much. */
export const MIN_STEP_MM = 1;

/**
 * Cost caps of one outline: its UTF-8 size (checked by the request schema), its path segments (commands
 * and their implicit repeats, counted before paper.js parses it) and its vertices once curves are
 * flattened (counted from the parsed curves before flattening). Arcs are the costliest segments to
 * parse: 5,000 of them take paper.js a few tenths of a second on the 2-core CI machine.
 */
export const OUTLINE_MAX_BYTES = 200_000;
export const OUTLINE_MAX_SEGMENTS = 5_000;
export const OUTLINE_MAX_VERTICES = 100_000;
/** Largest distance between a curve and the chords that replace it. */
export const FLATTEN_TOLERANCE_MM = 0.01;
/** How far an outline may stray outside its footprint (drawing slack) before it is refused. */
export const OUTLINE_FOOTPRINT_SLACK_MM = 0.5;
export const OUTLINE_MIN_AREA_MM2 = 0.01;

/** The most a border may reach under the field (negative gap to the field), mm. */
export const BORDER_GAP_TO_FIELD_MIN_MM = -STAMP_SIDE_MAX_MM;
/**
 * Where the field and a border overlap, the engine unites them over one common period (the least common multiple
 * of their periods on the polygon grid) when it is at most this long; over a window this long otherwise.
 */
export const OVERLAP_PERIOD_MAX_MM = 10_000;
/** Length of the pieces the overlap windows are cut into, to keep each union small. */
export const OVERLAP_CHUNK_MM = 900;

/** A diagonal step must be p/q with q at most this, so the layout repeats after q rows. */
export const DIAGONAL_MAX_DENOMINATOR = 12;
export const ROTATION_ORDERS = [2, 3, 4, 6] as const;

export const WINDOW_DEFAULT_LENGTH_MM = 1000;
export const WINDOW_MAX_LENGTH_MM = 10_000;
export const WINDOW_MAX_IMPRESSIONS = 20_000;

/** Work limits of one area window (one period of rows with its neighbours). */
export const AREA_WINDOW_MAX_IMPRESSIONS = 20_000;
export const AREA_WINDOW_MAX_VERTICES = 4_000_000;

/**
 * Integer grid of the polygon engines: 1e5 units per mm (10 nm). Each engine rounds the points where edges cross to
 * this grid; at 10 nm clipper-lib and Clipper2 agree on waxed areas to better than 1e-9 (at 0.1 µm, 5e-9 for a
 * 200-point motif). Clipper2 works in 64-bit integers; clipper-lib switches to its slower full range past ±474 mm,
 * so the area windows are cut into tiles (AREA_TILE_MAX_MM).
 */
export const CLIPPER_UNITS_PER_MM = 1e5;
/** Windows are united in tiles of at most this many mm a side: coordinates from a tile's middle stay within ±4.5e7. */
export const AREA_TILE_MAX_MM = 900;
/** Slack for comparing positions that come from sums of floating-point lengths. */
export const EPS_MM = 1e-6;
