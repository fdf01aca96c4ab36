"use client";

import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useEffect, useMemo, useState, useTransition } from "react";

/**
 * State kept in the address (filters, sort, page), so a link or a reload shows the same view. Changes
 * go through the History API, which updates useSearchParams without asking the server to render again;
 * with `{ server: true }` (a page the server draws from its address, like the shelf's pictures) they replace
 * the address through the router instead, so the server draws the page again (`pending` while it does). Until
 * that navigation lands, `params` already holds the change, so a ticked box stays ticked and a second change
 * builds on the first.
 */
export function useUrlParams(options: { server?: boolean } = {}) {
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const current = searchParams.toString();
  const [ahead, setAhead] = useState<{ from: string; to: string } | null>(null);
  // The address the router landed on replaces what was set ahead of it.
  if (ahead && ahead.from !== current) setAhead(null);
  const aheadQuery = ahead && ahead.from === current ? ahead.to : null;
  const params: URLSearchParams = useMemo(() => (aheadQuery !== null ? new URLSearchParams(aheadQuery) : searchParams), [aheadQuery, searchParams]);
  const go = (qs: string) => {
    const url = qs ? `${pathname}?${qs}` : pathname;
    if (!options.server) return window.history.replaceState(null, "", url);
    setAhead({ from: current, to: qs });
    startTransition(() => router.replace(url, { scroll: false }));
  };
  /** Sets or clears (null, "") the named params; a change of filter goes back to the first page. */
  const set = (changes: Record<string, string | null>, resetPage = true) => {
    const next = new URLSearchParams(params.toString());
    for (const [key, value] of Object.entries(changes)) {
      if (value === null || value === "") next.delete(key);
      else next.set(key, value);
    }
    if (resetPage) next.delete("page");
    go(next.toString());
  };
  return { params, set, clear: () => go(""), pending };
}

/** A text box bound to a URL param that updates the address a moment after typing stops. */
export function useDebouncedParam(url: ReturnType<typeof useUrlParams>, name: string, delayMs = 300) {
  const value = url.params.get(name) ?? "";
  const [draft, setDraft] = useState(value);
  const [last, setLast] = useState(value);
  if (value !== last) {
    setLast(value);
    setDraft(value);
  }
  useEffect(() => {
    if (draft === value) return;
    const timer = setTimeout(() => url.set({ [name]: draft.trim() || null }), delayMs);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- url.set is rebuilt each render; the draft drives this
  }, [draft]);
  return [draft, setDraft] as const;
}
