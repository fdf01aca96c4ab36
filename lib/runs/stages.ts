import type { Face, StageKind } from "./schema";

/** What the default stages need of a colourway: its colours in the order of work. */
export interface ColourwayColour {
  position: number;
  name: string;
  swatch: string;
  /** The stamps that wax over this colour before the next colour, and on which face. */
  waxStamps: readonly string[];
  face: Face;
  /** The colourway says this colour is reached by bleaching (the ground taken back), not by dyeing. */
  bleach?: boolean;
}

export interface DefaultStage {
  kind: StageKind;
  colourPosition: number | null;
  colourName: string | null;
  swatch: string | null;
  waxMethod: "stamp" | null;
  faces: Face | null;
  dyeMethod: "bath" | null;
  stamps: { code: string; face: Face }[];
}

/**
 * The stages a run gets by default from its colourway (SPEC section 1, "the run ties them together"): for each
 * colour in the order of work, the colour stage (a dye bath, or a bleaching where the colourway says so), then a
 * waxing stage over what must keep that colour — when the colour names stamps to wax over it; the boil-off last.
 * A waxing stage stamps by default (a screen is chosen by editing the stage); the dye stage is a bath.
 */
export function defaultStages(colours: readonly ColourwayColour[]): DefaultStage[] {
  const ordered = [...colours].sort((a, b) => a.position - b.position);
  const stages: DefaultStage[] = [];
  for (const c of ordered) {
    const colour = { colourPosition: c.position, colourName: c.name, swatch: c.swatch };
    stages.push({ kind: c.bleach ? "bleach" : "dye", ...colour, waxMethod: null, faces: null, dyeMethod: c.bleach ? null : "bath", stamps: [] });
    if (c.waxStamps.length > 0) {
      stages.push({ kind: "wax", ...colour, waxMethod: "stamp", faces: c.face, dyeMethod: null, stamps: c.waxStamps.map((code) => ({ code, face: c.face })) });
    }
  }
  stages.push({ kind: "boil_off", colourPosition: null, colourName: null, swatch: null, waxMethod: null, faces: null, dyeMethod: null, stamps: [] });
  return stages;
}

/** The stage a run is at: the first (by position) not done, null when every stage is done. */
export function currentStage<S extends { position: number; state: string }>(stages: readonly S[]): S | null {
  return [...stages].sort((a, b) => a.position - b.position).find((s) => s.state !== "done") ?? null;
}
