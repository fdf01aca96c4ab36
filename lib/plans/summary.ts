import type { LayoutResult } from "@/lib/layout";

/**
 * What a saved plan keeps of the engine's answer: every figure, without the preview, the impression list and the
 * window they were drawn for. Totals take every layer (field and borders) and every face the plan waxes:
 * `waxedAreaPerMetreM2` is the waxed area per metre of cloth for one face × `sides`, overlaps counted once.
 */
export type PlanSummary = Omit<LayoutResult, "preview" | "impressions" | "window">;

export function planSummary(result: LayoutResult): PlanSummary {
  const { preview: _preview, impressions: _impressions, window: _window, ...summary } = result;
  void _preview;
  void _impressions;
  void _window;
  return summary;
}
