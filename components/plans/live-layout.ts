import { LayoutInputError, layoutOf, layoutPicture, type LayoutPicture, type LayoutResult, type LayoutSpec, type StampSize } from "@/lib/layout";
import { issueMessage, issuePath, type MessageValues } from "@/lib/errors";
import { clipperLibBackend } from "@/lib/layout/polygon";
import { resolveLayoutRequest, type LayoutRequestLike } from "@/lib/plans";
import { layoutRequestSchema } from "@/lib/validation/layout";
import { parseInput } from "@/lib/validation/parse";

// The planner's numbers, computed in the browser with the same engine and the same request schema as
// POST /api/v1/layout (measured faster than the round trip: see scripts/bench-planner.ts), and its picture window.
// The page runs computeLive in a Web Worker (layout-worker.ts, use-live-layout.ts), so it never blocks typing.

export interface LiveIssue {
  /** The plan input's path ("layout.cloth.widthMm", "borders.0.gapYMm"). */
  path: string;
  key: string;
  values: MessageValues;
}

export type LiveOutcome = { ok: true; spec: LayoutSpec; result: LayoutResult; engineMs: number } | { ok: false; issues: LiveIssue[] };

/** Engine paths ("cloth.widthMm") → the plan input's ("layout.cloth.widthMm"); borders sit beside the layout. */
const planPath = (path: string) => (path === "_form" ? "_form" : path.startsWith("borders") ? path : `layout.${path}`);

/** Lays out the planner's `{ layout, borders }` with the library stamps in `geometry` (by upper-case code). */
export function computeLive(input: { layout: Record<string, unknown>; borders: unknown[] }, geometry: ReadonlyMap<string, StampSize>): LiveOutcome {
  const parsed = parseInput(layoutRequestSchema, { ...input.layout, borders: input.borders, impressions: false, preview: false });
  if (!parsed.success) {
    return {
      ok: false,
      issues: parsed.error.issues.map((issue) => {
        const { key, values } = issueMessage(issue);
        return { path: planPath(issuePath(issue)), key, values };
      }),
    };
  }
  try {
    const spec = resolveLayoutRequest(parsed.data as unknown as LayoutRequestLike, geometry);
    const started = performance.now();
    // clipper-lib, named here: the engine's default would load Clipper2's WebAssembly, whose glue needs eval, which
    // the page's Content-Security-Policy refuses.
    const result = layoutOf(spec, { polygons: clipperLibBackend });
    const engineMs = performance.now() - started;
    return { ok: true, spec, result, engineMs };
  } catch (error) {
    if (!(error instanceof LayoutInputError)) throw error;
    return {
      ok: false,
      issues: error.issues.map((i) => ({ path: planPath(i.field), key: i.messageKey, values: Object.fromEntries(Object.entries(i.params).map(([k, v]) => [k, typeof v === "boolean" ? String(v) : v])) })),
    };
  }
}

/** The picture of a window of the first piece; null when the window cannot be drawn (a refusal the numbers show). */
export function livePicture(spec: LayoutSpec, window: { startMm: number; lengthMm: number }): LayoutPicture | null {
  try {
    return layoutPicture(spec, window);
  } catch (error) {
    if (error instanceof LayoutInputError) return null;
    throw error;
  }
}
