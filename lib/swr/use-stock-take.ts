import useSWR from "swr";
import type { StockTakeDto } from "@/lib/data/stock-takes";
import { apiFetch } from "./fetcher";

export const stockTakeKey = (id: string) => `/api/v1/stock-takes/${id}`;

/** A count's progress and report; refreshed after each sighting and every few seconds while open (several people may count at once). */
export function useStockTake(id: string, fallback: StockTakeDto) {
  return useSWR(stockTakeKey(id), (url: string) => apiFetch<{ stockTake: StockTakeDto }>(url), {
    fallbackData: { stockTake: fallback },
    refreshInterval: (latest) => (latest?.stockTake.status === "open" ? 5000 : 0),
  });
}
