import useSWR from "swr";
import type { StampPage } from "@/lib/data/stamps";
import { apiFetch } from "./fetcher";

export const stampsKey = (query: string) => `/api/v1/stamps${query ? `?${query}` : ""}`;

/** One page of the stamp table; the previous page stays on screen while the next one loads. */
export function useStamps(query: string) {
  return useSWR(stampsKey(query), (url: string) => apiFetch<StampPage>(url), { keepPreviousData: true });
}
