import { mmToYards } from "@/lib/units";

/** 1 kodi = 20 pieces: how the trade counts cloth (common practice, SPEC section 1). */
export const PIECES_PER_KODI = 20;

/**
 * The default stamping rate, impressions per hour on one face. No published figure exists: this is derived from
 * the common practice that a whole long cloth takes a stamper roughly 2–3 hours per face (SPEC section 1). A long
 * cloth of 106 cm mori is about 2.5 × its width long (2.65 m); a 20 × 20 cm stamp (common practice) lays 5 whole
 * impressions across and 13 whole rows down it, 65 impressions, so 65 / 2.5 h = 26 an hour (22–33 over 2–3 hours).
 * A workshop setting; the workshop replaces it with its own pace.
 */
export const DEFAULT_IMPRESSIONS_PER_HOUR_PER_FACE = 26;

export interface RunSize {
  runLengthMm: number;
  metres: number;
  yards: number;
  pieces: number;
  pieceLengthMm: number;
  /** Pieces in kodi (20 pieces each); fractional when the pieces are not whole kodi. */
  kodi: number;
  /** Whether the run was given as pieces of a length (or kodi) rather than one length. */
  byPieces: boolean;
}

/** The run in metres, yards (1 yd = 0.9144 m, NIST SP 811), pieces and kodi. */
export function runSize(summary: { runLengthMm: number; pieces: number; pieceLengthMm: number }, byPieces: boolean): RunSize {
  return {
    runLengthMm: summary.runLengthMm,
    metres: summary.runLengthMm / 1000,
    yards: mmToYards(summary.runLengthMm),
    pieces: summary.pieces,
    pieceLengthMm: summary.pieceLengthMm,
    kodi: summary.pieces / PIECES_PER_KODI,
    byPieces,
  };
}

export interface StampingTime {
  /** Impressions per hour on one face, as the workshop set it. */
  impressionsPerHour: number;
  /** Hours for the whole run (every face: each face's impressions at the rate), and for one piece. */
  hoursTotal: number;
  hoursPerPiece: number;
  /** Impressions on one piece (every face and layer). */
  impressionsPerPiece: number;
}

/**
 * Stamping hours: impressions ÷ impressions per hour. The rate is per face, and the impression counts already hold
 * every face the plan waxes (a second face doubles them), so hours = impressionsTotal / rate.
 */
export function stampingTime(summary: { impressionsTotal: number; pieces: number }, impressionsPerHour: number): StampingTime {
  const impressionsPerPiece = summary.impressionsTotal / summary.pieces;
  return {
    impressionsPerHour,
    hoursTotal: summary.impressionsTotal / impressionsPerHour,
    hoursPerPiece: impressionsPerPiece / impressionsPerHour,
    impressionsPerPiece,
  };
}
