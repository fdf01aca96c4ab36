import useSWR from "swr";
import { peopleUrls, type ApiTokenDto } from "@/lib/contracts/people";
import { apiFetch } from "./fetcher";

export const apiTokensKey = peopleUrls.tokens();

export function useApiTokens() {
  return useSWR(apiTokensKey, (url: string) => apiFetch<{ tokens: ApiTokenDto[] }>(url));
}
