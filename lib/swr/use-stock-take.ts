import useSWR from "swr";
import { stampUrls, type StockTakeDto } from "@/lib/contracts/stamps";
import { apiFetch } from "./fetcher";

export const stockTakeKey = stampUrls.stockTake;

/** A count's progress and report; refreshed after each sighting and every few seconds while open (several people may count at once). */
export function useStockTake(id: string, fallback: StockTakeDto) {
  return useSWR(stockTakeKey(id), (url: string) => apiFetch<{ stockTake: StockTakeDto }>(url), {
    fallbackData: { stockTake: fallback },
    refreshInterval: (latest) => (latest?.stockTake.status === "open" ? 5000 : 0),
  });
}
