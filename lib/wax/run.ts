import { z } from "@/lib/zod";
import { keyed, parseWax } from "./errors";
import { KODI_PIECES, PIECE_LENGTH_MAX_MM, PIECES_MAX, RUN_MAX_METRES } from "./limits";

const pieceLengthMm = z.number(keyed).gt(0, { error: "wax.mustBePositive" }).max(PIECE_LENGTH_MAX_MM, keyed);

/**
 * A run given in exactly one way: metres, pieces of a length, or kodi (20 pieces) of a length. Lengths in mm,
 * as stored. Refuses a mix of ways ("wax.runLength") and runs over 2 km ("wax.runTooLong").
 */
export const runLengthSchema = z
  .object(
    {
      metres: z.number(keyed).gt(0, { error: "wax.mustBePositive" }).max(RUN_MAX_METRES, keyed).optional(),
      pieces: z.number(keyed).int(keyed).min(1, keyed).max(PIECES_MAX, keyed).optional(),
      kodi: z.number(keyed).int(keyed).min(1, keyed).max(PIECES_MAX / KODI_PIECES, keyed).optional(),
      pieceLengthMm: pieceLengthMm.optional(),
    },
    keyed,
  )
  .superRefine((run, ctx) => {
    const ways = [run.metres, run.pieces, run.kodi].filter((v) => v !== undefined).length;
    if (ways !== 1 || (run.metres !== undefined && run.pieceLengthMm !== undefined)) {
      ctx.addIssue({ code: "custom", path: [], message: "wax.runLength" });
      return;
    }
    if (run.metres === undefined && run.pieceLengthMm === undefined) {
      ctx.addIssue({ code: "custom", path: ["pieceLengthMm"], message: "validation.required" });
      return;
    }
    const metres = runMetresOf(toRun(run));
    if (Number.isFinite(metres) && metres > RUN_MAX_METRES) {
      ctx.addIssue({ code: "custom", path: [], message: "wax.runTooLong", params: { maxM: RUN_MAX_METRES } });
    }
  })
  .transform(toRun);

type RunFields = { metres?: number; pieces?: number; kodi?: number; pieceLengthMm?: number };

function toRun(run: RunFields): { metres: number } | { pieces: number; pieceLengthMm: number } | { kodi: number; pieceLengthMm: number } {
  if (run.metres !== undefined) return { metres: run.metres };
  if (run.pieces !== undefined) return { pieces: run.pieces, pieceLengthMm: run.pieceLengthMm ?? 0 };
  return { kodi: run.kodi ?? 0, pieceLengthMm: run.pieceLengthMm ?? 0 };
}

export type RunLength = z.output<typeof runLengthSchema>;
export type RunLengthInput = z.input<typeof runLengthSchema>;

/** Pieces in a number of kodi: kodi × 20 (a trade unit of 20 pieces, common practice). */
export function piecesFromKodi(kodi: number): number {
  return kodi * KODI_PIECES;
}

/** Run length in metres of whole pieces: pieces × piece length mm / 1000. */
export function metresFromPieces(pieces: number, pieceLengthMm: number): number {
  return (pieces * pieceLengthMm) / 1000;
}

/** Run length in metres of kodi of pieces: kodi × 20 × piece length mm / 1000. */
export function metresFromKodi(kodi: number, pieceLengthMm: number): number {
  return metresFromPieces(piecesFromKodi(kodi), pieceLengthMm);
}

function runMetresOf(run: RunLength): number {
  if ("metres" in run) return run.metres;
  if ("pieces" in run) return metresFromPieces(run.pieces, run.pieceLengthMm);
  return metresFromKodi(run.kodi, run.pieceLengthMm);
}

/** Metres of cloth in a run given in metres, pieces or kodi; throws WaxInputError for bad input or a run over 2 km. */
export function runMetres(input: unknown): number {
  return runMetresOf(parseWax(runLengthSchema, input));
}
