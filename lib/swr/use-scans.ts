import useSWR from "swr";
import type { CoveragePreviewDto, ScanDto, SimilarStampDto } from "@/lib/data/scans";
import { apiFetch } from "./fetcher";

export const scansKey = (code: string) => `/api/v1/stamps/${encodeURIComponent(code)}/scans`;
export const similarKey = (code: string) => `/api/v1/stamps/${encodeURIComponent(code)}/similar`;

export interface ScansAnswer {
  scans: ScanDto[];
  limits: { maxBytes: number; maxPixels: number };
}

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
  return useSWR(`${scansKey(scan.stampCode)}/${scan.id}/coverage?${query}`, (url: string) => apiFetch<{ coverage: CoveragePreviewDto }>(url), { keepPreviousData: true });
}
