import type { Pattern } from "./arrangements";
import type { Arrangement, PathName, PlaneGroup } from "./types";

const PATH_NAMES: Partial<Record<Arrangement, PathName>> = {
  straight: "tubruk",
  "half-drop": "ondo-ende",
  brick: "ondo-ende",
  diagonal: "parang",
  rotation: "mubeng",
};

/** Javanese stamping-path name for an arrangement (tubruk, ondo-ende, parang, mubeng), or null where none fits. */
export function pathNameOf(arrangement: Arrangement): PathName | null {
  return PATH_NAMES[arrangement] ?? null;
}

function near(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
}

/**
 * Plane symmetry group of the layout of an asymmetric motif (International Tables for Crystallography, Vol. A):
 * translations only (straight, half-drop, brick, diagonal) p1; mirrored columns pm; rows turned 180° p2;
 * mirrored dropped columns pg. A rosette of n copies keeps its n-fold turn only on a lattice that has it:
 * n = 4 needs a square cell (else p2), n = 3 and 6 a hexagonal one (else p1 and p2); n = 2 is always p2.
 */
export function planeGroupOf(pattern: Pattern): PlaneGroup {
  switch (pattern.arrangement) {
    case "mirror":
      return "pm";
    case "half-drop-mirror":
      return "pg";
    case "turnover":
      return "p2";
    case "rotation": {
      const n = pattern.rotationOrder ?? 4;
      if (n === 2) return "p2";
      if (n === 4) return near(pattern.pitchXMm, pattern.rowPitchMm) ? "p4" : "p2";
      const hexagonal = pattern.hexagonal && near(pattern.rowPitchMm, (pattern.pitchXMm * Math.sqrt(3)) / 2);
      if (n === 3) return hexagonal ? "p3" : "p1";
      return hexagonal ? "p6" : "p2";
    }
    default:
      return "p1";
  }
}
