import { LayoutInputError, withBorders, withStamp, type LayoutSpec, type StampSize } from "@/lib/layout";
import { WINDOW_DEFAULT_LENGTH_MM } from "@/lib/layout/limits";

// How a library stamp becomes the engine's stamp, and how a layout that names stamps by code becomes the engine's
// input. The server (lib/data/layout.ts, the plans) and the planner in the browser resolve codes the same way.

/** What the shelf records of a stamp's geometry (mm; coverage 0–1; outline as SVG path data in mm). */
export interface LibraryStampGeometry {
  widthMm: number;
  heightMm: number;
  coverageRatio: number | null;
  outlinePath: string | null;
}

/**
 * The engine's stamp for a library stamp: its outline when it has one, else its measured coverage ratio (from a
 * scan), else the whole footprint. The coverage counts only without an outline, as the engine uses it.
 */
export function engineStampOf(stamp: LibraryStampGeometry): StampSize {
  return {
    widthMm: stamp.widthMm,
    heightMm: stamp.heightMm,
    ...(stamp.outlinePath ? { outline: stamp.outlinePath } : stamp.coverageRatio !== null && stamp.coverageRatio > 0 ? { coverage: stamp.coverageRatio } : {}),
    fillRule: "nonzero",
  };
}

/** A stamp given by its sizes, or by the code of a library stamp. */
export type StampRef = StampSize | { code: string };

/** A parsed layout request whose field stamp and border stamps may be library codes. */
export type LayoutRequestLike = Omit<LayoutSpec, "stamp" | "borders" | "window" | "impressions" | "preview"> & Partial<Pick<LayoutSpec, "window" | "impressions" | "preview">> & {
  stamp: StampRef;
  borders: Array<Omit<LayoutSpec["borders"][number], "stamp"> & { stamp: StampRef }>;
};

const codeOf = (ref: StampRef): string | null => ("code" in ref ? ref.code.trim().toUpperCase() : null);

/** The library stamps a request names, by role: "field" and "border:<index>". */
export function stampCodesOf(request: LayoutRequestLike): { role: string; code: string }[] {
  const out: { role: string; code: string }[] = [];
  const field = codeOf(request.stamp);
  if (field) out.push({ role: "field", code: field });
  request.borders.forEach((b, k) => {
    const code = codeOf(b.stamp);
    if (code) out.push({ role: `border:${k}`, code });
  });
  return out;
}

/**
 * The engine input for a request (a saved plan's layout without view options too), its library stamps looked up in `geometry` (by upper-case code). A code that
 * is not there is refused like any other input, at `stamp.code` or `borders.<k>.stamp.code`.
 */
export function resolveLayoutRequest(request: LayoutRequestLike, geometry: ReadonlyMap<string, StampSize>): LayoutSpec {
  const missing = stampCodesOf(request).filter((s) => !geometry.has(s.code));
  if (missing.length) {
    throw new LayoutInputError(
      missing.map((s) => ({
        field: s.role === "field" ? "stamp.code" : `borders.${s.role.slice("border:".length)}.stamp.code`,
        code: "stampNotFound",
        messageKey: "validation.stampNotFound",
        params: { code: s.code },
      })),
    );
  }
  const resolve = (ref: StampRef) => (codeOf(ref) ? geometry.get(codeOf(ref)!)! : ref);
  const { stamp, borders, ...rest } = request;
  // A saved plan keeps no view options: the first metre, no impression list, no preview.
  const spec = withStamp({ window: { startMm: 0, lengthMm: WINDOW_DEFAULT_LENGTH_MM }, impressions: false, preview: false, ...rest, borders: [] }, resolve(stamp));
  return borders.length ? withBorders(spec, borders.map((b) => ({ ...b, stamp: resolve(b.stamp) }))) : spec;
}
