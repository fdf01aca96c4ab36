import useSWR from "swr";
import { planUrls, type PlanPage } from "@/lib/contracts/plans";
import { apiFetch } from "./fetcher";

/** One page of the plan table; the previous page stays on screen while the next one loads. */
export function usePlans(query: string) {
  return useSWR(planUrls.list(query), (url: string) => apiFetch<PlanPage>(url), { keepPreviousData: true });
}
