import { layoutError } from "./errors";
import { compose, translation, type Affine } from "./geometry";
import { countOf, intersectRanges, overlapRange, type Grid } from "./grid";
import { WINDOW_MAX_IMPRESSIONS } from "./limits";
import type { Impression, LayerName } from "./types";

/** A layer's grid, for the impression list. */
export interface ListedLayer {
  layer: LayerName;
  grid: Grid;
}

function frontOf({ layer, grid }: ListedLayer, rows: Array<{ first: number; last: number }>): Impression[] {
  const { pattern } = grid;
  const out: Impression[] = [];
  grid.sets.forEach((set, k) => {
    const { placement } = set;
    const fp = placement.footprint;
    for (let j = rows[k].first; j <= rows[k].last; j++) {
      for (let i = set.memberX.first; i <= set.memberX.last; i++) {
        const dx = grid.originXMm + i * pattern.pitchXMm;
        const dy = j * pattern.periodYMm;
        out.push({
          layer,
          face: "front",
          row: placement.row,
          rowIndex: j * pattern.rowsPerPeriod + placement.row,
          xMm: fp.x0 + dx,
          yMm: fp.y0 + dy,
          widthMm: fp.x1 - fp.x0,
          heightMm: fp.y1 - fp.y0,
          matrix: compose(translation(dx, dy), placement.matrix),
          rotationDeg: placement.rotationDeg,
          mirrored: placement.mirrored,
          whole: i >= set.insideX.first && i <= set.insideX.last && j >= set.insideY.first && j <= set.insideY.last,
        });
      }
    }
  });
  return out.sort((a, b) => a.rowIndex - b.rowIndex || a.yMm - b.yMm || a.xMm - b.xMm);
}

/**
 * Impressions whose footprint reaches into the window [startMm, endMm) of one piece (mm): layer by layer (the field,
 * then the left and the right border), each in stamping order (row by row, left to right). With sides = 2 each front
 * impression has a back one registered through the cloth: x → clothWidth − x, mirrored; a border's twin keeps its
 * layer name (the back of the left border lies on the right as the cloth is seen from the front). Throws
 * LayoutInputError when the window holds more than WINDOW_MAX_IMPRESSIONS.
 */
export function listImpressions(
  layers: readonly ListedLayer[],
  startMm: number,
  endMm: number,
  sides: 1 | 2,
  clothWidthMm: number,
): Impression[] {
  let total = 0;
  const ranges = layers.map(({ grid }) =>
    grid.sets.map((set) => {
      const fp = set.placement.footprint;
      const rows = intersectRanges(set.memberY, overlapRange(startMm, endMm, fp.y0, fp.y1, grid.pattern.periodYMm));
      total += countOf(rows) * countOf(set.memberX) * sides;
      return rows;
    }),
  );
  if (total > WINDOW_MAX_IMPRESSIONS) {
    throw layoutError("window.lengthMm", "windowTooLarge", { impressions: total, max: WINDOW_MAX_IMPRESSIONS });
  }

  const front = layers.flatMap((layer, k) => frontOf(layer, ranges[k]));
  if (sides === 1) return front;

  const throughCloth: Affine = [-1, 0, 0, 1, clothWidthMm, 0];
  const back = front.map(
    (f): Impression => ({
      ...f,
      face: "back",
      xMm: clothWidthMm - f.xMm - f.widthMm,
      matrix: compose(throughCloth, f.matrix),
      rotationDeg: (360 - f.rotationDeg) % 360,
      mirrored: !f.mirrored,
    }),
  );
  return [...front, ...back];
}
