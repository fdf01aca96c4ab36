// Types for the part of clipper-lib 6.4.2 the layout engine uses; the package ships none.
declare module "clipper-lib" {
  export interface IntPoint {
    X: number;
    Y: number;
  }
  export type Path = IntPoint[];
  export type Paths = Path[];

  export const ClipType: { ctIntersection: 0; ctUnion: 1; ctDifference: 2; ctXor: 3 };
  export const PolyType: { ptSubject: 0; ptClip: 1 };
  export const PolyFillType: { pftEvenOdd: 0; pftNonZero: 1; pftPositive: 2; pftNegative: 3 };
  export type ClipTypeValue = 0 | 1 | 2 | 3;
  export type PolyTypeValue = 0 | 1;
  export type PolyFillTypeValue = 0 | 1 | 2 | 3;

  export class Clipper {
    constructor(initOptions?: number);
    AddPath(path: Path, polyType: PolyTypeValue, closed: boolean): boolean;
    AddPaths(paths: Paths, polyType: PolyTypeValue, closed: boolean): boolean;
    Execute(
      clipType: ClipTypeValue,
      solution: Paths,
      subjFillType?: PolyFillTypeValue,
      clipFillType?: PolyFillTypeValue,
    ): boolean;
    static Area(path: Path): number;
    static Orientation(path: Path): boolean;
    static SimplifyPolygons(paths: Paths, fillType?: PolyFillTypeValue): Paths;
  }

  const ClipperLib: {
    Clipper: typeof Clipper;
    ClipType: typeof ClipType;
    PolyType: typeof PolyType;
    PolyFillType: typeof PolyFillType;
  };
  export default ClipperLib;
}
