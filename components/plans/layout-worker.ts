// The planner's layout engine off the page's main thread: the page posts the plan input and the library stamps'
// geometry, the worker answers the outcome (numbers or refusals), so typing never waits on a detailed motif's union.
import type { StampSize } from "@/lib/layout";
import { computeLive, type LiveOutcome } from "./live-layout";

export interface LiveRequest {
  id: number;
  input: { layout: Record<string, unknown>; borders: unknown[] };
  geometry: [string, StampSize][];
}

export interface LiveAnswer {
  id: number;
  outcome: LiveOutcome;
}

const scope = self as unknown as { onmessage: ((e: MessageEvent<LiveRequest>) => void) | null; postMessage(answer: LiveAnswer): void };

scope.onmessage = (e) => {
  const { id, input, geometry } = e.data;
  scope.postMessage({ id, outcome: computeLive(input, new Map(geometry)) });
};
