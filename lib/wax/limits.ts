/**
 * Bounds, tolerances and published figures of the wax estimator, shared with its zod schemas.
 * Temperatures in °C, densities in g/cm³, masses in g or kg as named, areas in m², lengths in m or mm as named.
 */

/** A mix may add up to 100 % ± this much (rounded entries such as 33.33 + 33.33 + 33.34); beyond it, refused. */
export const MIX_SUM_TOLERANCE_PCT = 0.01;
export const MIX_MAX_COMPONENTS = 12;

export const DENSITY_MIN_G_PER_CM3 = 0.5;
export const DENSITY_MAX_G_PER_CM3 = 2;
export const MELT_MIN_C = 0;
export const MELT_MAX_C = 300;
export const FLASH_POINT_MIN_C = 50;
export const FLASH_POINT_MAX_C = 600;
/** Working range of a pot; the flash-point rule below usually binds long before the top. */
export const WORKING_MIN_C = 20;
export const WORKING_MAX_C = 300;

/** Fumes (acrolein, paraffin fume) rise quickly above 100 °C / 212 °F (M. Rossol, Arts, Crafts & Theater Safety). */
export const FUME_WARNING_ABOVE_C = 100;
/** A working range may come no closer than this to the lowest flash point of its materials (SPEC 5.3). */
export const FLASH_POINT_MARGIN_C = 50;

export const NAME_MAX_CHARS = 100;
export const NOTES_MAX_CHARS = 4000;
export const MATERIAL_REF_MAX_CHARS = 100;
export const SOURCE_MAX_CHARS = 500;
/** Price per kg in the workshop's currency (IDR prices run to six figures). */
export const PRICE_MAX_PER_KG = 1e9;

/** Waxed area per metre of cloth: a 5 m wide cloth fully waxed on both faces is 10 m²; allow headroom. */
export const AREA_PER_METRE_MAX_M2 = 20;
/** 2 km, the layout engine's longest run. */
export const RUN_MAX_METRES = 2000;
export const PIECE_LENGTH_MAX_MM = 2_000_000;
export const PIECES_MAX = 10_000;
export const PASSES_MAX = 20;
export const RATE_MAX_G_PER_M2 = 2000;
export const LOSS_MAX_PCT = 100;
export const RECOVERY_MAX_PCT = 100;
/** A trade unit of 20 pieces (Indonesian trade, common practice). */
export const KODI_PIECES = 20;

/** Largest stock or reorder level of one material. */
export const STOCK_MAX_KG = 1e6;
/** Largest pot weighing or grams used by one wax use. */
export const USE_MAX_G = 1e7;
export const CALIBRATION_MIN_USES_DEFAULT = 3;

/**
 * Wax per metre of stamped batik, whole process (all waxing stages, both faces): benchmark 100–150 g/m,
 * measured 152, 191 and 242 g/m at three small workshops (I. Nurdalia, master's thesis, Universitas Diponegoro,
 * 2006). SPEC section 1 and 5.3 round the sanity band to about 100–250 g/m.
 */
export const PUBLISHED_BAND = {
  benchmarkGPerM: { min: 100, max: 150 },
  measuredGPerM: [152, 191, 242],
  sanityGPerM: { min: 100, max: 250 },
  source: "I. Nurdalia, Universitas Diponegoro, 2006",
} as const;

/**
 * Default application rate, g per m² of waxed area per pass — derived, not published: a wax film about 0.1 mm
 * deep in and on the cotton (from memory; SOURCES.md lists film thickness as not found) × the 60/40
 * beeswax/paraffin mix's 0.935 g/cm³ ≈ 93 g/m², rounded down to 90. Cross-check: a 20 × 20 cm stamp at 40 %
 * coverage, 5 across, both faces, 2–3 passes waxes 1.6–2.4 m² per metre, so 90 g/m² gives 144–216 g/m, inside
 * Nurdalia's published band. A calibrated rate replaces it.
 */
export const DEFAULT_RATE_G_PER_M2 = 90;
