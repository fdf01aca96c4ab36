// Types for the part of clipper2-wasm 0.4.0 the layout engine uses. The package's own "types" entry points at a
// file it does not ship, and its declarations have no default export.
declare module "clipper2-wasm" {
  interface Deletable {
    delete(): void;
  }
  export interface Path64 extends Deletable {
    /** Points as [x, y, z] triplets (this is the build with a z coordinate). */
    assign(coordinates: BigInt64Array): void;
    size(): number;
  }
  export interface Paths64 extends Deletable {
    push_back(path: Path64): void;
    size(): number;
  }
  export interface FillRuleValue {
    value: number;
  }
  export interface Clipper2Module {
    Path64: new () => Path64;
    Paths64: new () => Paths64;
    FillRule: { EvenOdd: FillRuleValue; NonZero: FillRuleValue; Positive: FillRuleValue; Negative: FillRuleValue };
    UnionSelf64(subjects: Paths64, fillRule: FillRuleValue): Paths64;
    AreaPaths64(paths: Paths64): number;
  }
  const factory: (options?: { wasmBinary?: ArrayBuffer | Uint8Array; locateFile?: (path: string, dir: string) => string }) => Promise<Clipper2Module>;
  export default factory;
}
