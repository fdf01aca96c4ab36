"use client";

import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useEffect, useState, useTransition } from "react";

/**
 * State kept in the address (filters, sort, page), so a link or a reload shows the same view. Changes
 * go through the History API, which updates useSearchParams without asking the server to render again;
 * with `{ server: true }` (a page the server draws from its address, like the shelf's pictures) they replace
 * the address through the router instead, so the server draws the page again (`pending` while it does).
 */
export function useUrlParams(options: { server?: boolean } = {}) {
  const pathname = usePathname();
  const params = useSearchParams();
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const go = (url: string) => (options.server ? startTransition(() => router.replace(url, { scroll: false })) : window.history.replaceState(null, "", url));
  /** Sets or clears (null, "") the named params; a change of filter goes back to the first page. */
  const set = (changes: Record<string, string | null>, resetPage = true) => {
    const next = new URLSearchParams(params.toString());
    for (const [key, value] of Object.entries(changes)) {
      if (value === null || value === "") next.delete(key);
      else next.set(key, value);
    }
    if (resetPage) next.delete("page");
    const qs = next.toString();
    go(qs ? `${pathname}?${qs}` : pathname);
  };
  return { params, set, clear: () => go(pathname), pending };
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
