"use client";

import { useEffect, useRef, useState } from "react";
import type { StampSize } from "@/lib/layout";
import type { LiveAnswer, LiveRequest } from "./layout-worker";
import { computeLive, type LiveOutcome } from "./live-layout";

export type SeenOutcome = LiveOutcome & { seq: number };

type Input = LiveRequest["input"];

/**
 * The planner's live outcome for `input`: laid out in a Web Worker as soon as it changes, with no fixed debounce.
 * While the worker is busy only the newest input waits (older ones are dropped), and an answer is shown only when
 * it is for the newest input, so fast typing costs one layout per pause, never a queue. Where no worker can be
 * started, the same engine runs on the page after a short pause.
 */
export function useLiveLayout(input: Input, geometry: ReadonlyMap<string, StampSize>, key: string, waiting: boolean): SeenOutcome | null {
  const [outcome, setOutcome] = useState<SeenOutcome | null>(null);
  const worker = useRef<Worker | null | undefined>(undefined);
  const busy = useRef(false);
  const pending = useRef<LiveRequest | null>(null);
  const last = useRef<LiveRequest | null>(null);
  const latest = useRef(0);
  const seq = useRef(0);

  const show = (next: LiveOutcome) => {
    if (next.ok) performance.measure("capgrid:plan-engine", { start: performance.now() - next.engineMs, duration: next.engineMs });
    setOutcome({ ...next, seq: ++seq.current });
  };

  useEffect(() => {
    try {
      const w = new Worker(new URL("./layout-worker.ts", import.meta.url), { name: "capgrid-layout" });
      w.onmessage = (e: MessageEvent<LiveAnswer>) => {
        busy.current = false;
        const next = pending.current;
        pending.current = null;
        if (next) {
          busy.current = true;
          w.postMessage(next);
        } else if (e.data.id === latest.current) show(e.data.outcome);
      };
      w.onerror = () => {
        // The worker could not run (a blocked script, an old browser): lay out on the page from now on, starting
        // with the newest input, which would otherwise wait for an answer that never comes.
        worker.current = null;
        busy.current = false;
        const request = pending.current ?? last.current;
        pending.current = null;
        if (request) show(computeLive(request.input, new Map(request.geometry)));
      };
      worker.current = w;
    } catch {
      worker.current = null;
    }
    return () => {
      worker.current?.terminate();
      worker.current = undefined;
    };
  }, []);

  useEffect(() => {
    if (waiting) return;
    const request: LiveRequest = { id: ++latest.current, input, geometry: [...geometry.entries()] };
    last.current = request;
    const w = worker.current;
    if (w) {
      if (busy.current) pending.current = request;
      else {
        busy.current = true;
        w.postMessage(request);
      }
      return;
    }
    // No worker (yet, or at all): the page lays out itself, after a pause while someone types.
    const timer = setTimeout(() => show(computeLive(input, geometry)), outcome ? 80 : 0);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the key covers the input and the stamps it needs
  }, [key, waiting]);

  return outcome;
}
