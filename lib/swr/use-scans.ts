import useSWR from "swr";
import { scanUrls, type CoveragePreviewDto, type ScanDto, type ScansAnswer, type SimilarStampDto } from "@/lib/contracts/scans";
import { apiFetch } from "./fetcher";

export const scansKey = scanUrls.list;
export const similarKey = scanUrls.similar;
export type { ScansAnswer };

/** A stamp's scans, newest first, with the upload limits of this server. */
export function useScans(code: string, fallback?: ScansAnswer) {
  return useSWR(scansKey(code), (url: string) => apiFetch<ScansAnswer>(url), { fallbackData: fallback });
}

/** Stamps whose scans look like this stamp's. */
export function useSimilarStamps(code: string) {
  return useSWR(similarKey(code), (url: string) => apiFetch<{ stamps: SimilarStampDto[] }>(url));
}

/** Coverage at a polarity and threshold (Otsu's when null); the last answer stays while the next one loads. */
export function useCoveragePreview(scan: Pick<ScanDto, "stampCode" | "id">, polarity: string, threshold: number | null) {
  const query = new URLSearchParams({ polarity, ...(threshold !== null ? { threshold: String(threshold) } : {}) });
  return useSWR(scanUrls.coverage(scan.stampCode, scan.id, String(query)), (url: string) => apiFetch<{ coverage: CoveragePreviewDto }>(url), { keepPreviousData: true });
}
