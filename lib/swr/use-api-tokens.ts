import useSWR from "swr";
import type { ApiTokenDto } from "@/lib/data/api-tokens";
import { apiFetch } from "./fetcher";

export const apiTokensKey = "/api/v1/tokens";

export function useApiTokens() {
  return useSWR(apiTokensKey, (url: string) => apiFetch<{ tokens: ApiTokenDto[] }>(url));
}
