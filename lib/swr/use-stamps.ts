import useSWR from "swr";
import { stampUrls, type StampPage } from "@/lib/contracts/stamps";
import { apiFetch } from "./fetcher";

export const stampsKey = (query: string) => stampUrls.list(query);

/** One page of the stamp table; the previous page stays on screen while the next one loads. */
export function useStamps(query: string) {
  return useSWR(stampsKey(query), (url: string) => apiFetch<StampPage>(url), { keepPreviousData: true });
}
