import useSWR from "swr";
import { planUrls, type PlannerStamp, type StampChoice } from "@/lib/contracts/plans";
import { apiFetch } from "./fetcher";

/** One library stamp as the planner computes and draws it; null code: nothing asked. Kept while the planner is open. */
export function usePlannerStamp(code: string | null) {
  return useSWR(code ? planUrls.stamp(code) : null, (url: string) => apiFetch<{ stamp: PlannerStamp }>(url).then((a) => a.stamp), {
    revalidateOnFocus: false,
    shouldRetryOnError: false,
  });
}

/** The planner's stamp search (code or name); the previous results stay while the next ones load. */
export function usePlanStampSearch(q: string) {
  return useSWR(q.trim() ? planUrls.stamps(q.trim()) : null, (url: string) => apiFetch<{ stamps: StampChoice[] }>(url).then((a) => a.stamps), { keepPreviousData: true });
}
