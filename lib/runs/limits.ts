/** Limits of run inputs. */
export const RUN_NAME_MAX_CHARS = 120;
export const RUN_STAGES_MAX = 40;
export const RUN_PLANS_MAX = 8;
export const STAGE_STAMPS_MAX = 20;
export const NOTE_MAX_CHARS = 2000;
/** One day's recorded work at most: 2 km of cloth, 5,000 pieces, 200,000 impressions, 500 kg of wax in the pot. */
export const PROGRESS_MAX_METRES = 2000;
export const PROGRESS_MAX_PIECES = 5000;
export const PROGRESS_MAX_IMPRESSIONS = 200_000;
export const POT_MAX_G = 500_000;
/** A reading outside −20…400 °C is a typing slip, not a pot. */
export const READING_MIN_C = -20;
export const READING_MAX_C = 400;
export const FINDING_MAX_COUNT = 10_000;

/**
 * The flag rule: a stamp named by this many findings of one kind within this many days is flagged for the keepers.
 * Common practice (the "say three of one kind within 30 days"), not a published figure.
 */
export const FLAG_FINDINGS = 3;
export const FLAG_WINDOW_DAYS = 30;

/** Water boils at 100 °C at sea level (IUPAC standard pressure, 1 atm); a wax pot above it fumes quickly (SPEC 5.3). */
export const READING_FUME_ABOVE_C = 100;
