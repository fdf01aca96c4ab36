// Stamp scans' contract with their clients: the shapes the scan routes answer with and their URLs.
// Neither server-only nor React.
import type { SizeComparison, WaxPolarity } from "@/lib/scans";

export interface ScanDto {
  id: string;
  stampCode: string;
  kind: "face" | "print";
  fileName: string;
  contentType: string;
  widthPx: number;
  heightPx: number;
  dpi: number | null;
  dpiSource: "file" | "keeper" | null;
  sizeBytes: number;
  sha256: string;
  polarity: WaxPolarity;
  threshold: number;
  otsuThreshold: number;
  coverageRatio: number;
  /** Physical size from pixels and DPI, mm; null without a DPI. */
  sizeMm: { widthMm: number; heightMm: number } | null;
  /** The measured size against the stamp's record (warn above 3 %); null without a DPI. */
  sizeCheck: Pick<SizeComparison, "widthDeviationPct" | "heightDeviationPct" | "maxDeviationPct" | "warn" | "turned" | "tolerancePct"> | null;
  uploadedByName: string;
  createdAt: string;
  urls: { thumb: string; large: string; download: string; overlay: string };
}

export interface ScanUpload {
  key: string;
  url: string;
  method: "PUT";
  headers: Record<string, string>;
  expiresAt: string;
}

export interface SimilarStampDto {
  code: string;
  name: string;
  scanId: string;
  /** 0 the same … 1 the opposite (lib/scans/similar.ts). */
  distance: number;
  close: boolean;
  /** "mirrored": this stamp's motif mirrored looks like the other one (a back-face twin). */
  orientation: "same" | "mirrored";
  urls: { thumb: string };
}

/** One answer of search by picture: a stamp whose scan looks like the picture. */
export interface SimilarMatchDto {
  stampCode: string;
  stampName: string;
  motifId: string | null;
  scanId: string;
  /** 0 the same … 1 the opposite. */
  distance: number;
  /** The match needed a mirror (beyond the one between a face photo and a print): a back-face twin. */
  mirrored: boolean;
  /** Within the distance that counts as close (CLOSE_DISTANCE). */
  close: boolean;
  urls: { thumb: string };
}

export interface CoveragePreviewDto {
  polarity: WaxPolarity;
  threshold: number;
  otsuThreshold: number;
  ratio: number;
  /** The footprint counted, as fractions of the scan (for drawing it); null = the whole scan. */
  footprint: { left: number; top: number; width: number; height: number } | null;
}

// --- URLs of the scan routes -----------------------------------------------------------------

const scansBase = (code: string) => `/api/v1/stamps/${encodeURIComponent(code)}/scans`;

export const scanUrls = {
  list: (code: string) => scansBase(code),
  uploads: (code: string) => `${scansBase(code)}/uploads`,
  one: (code: string, id: string) => `${scansBase(code)}/${id}`,
  image: (code: string, id: string, size: "thumb" | "large") => `${scansBase(code)}/${id}/image?size=${size}`,
  download: (code: string, id: string) => `${scansBase(code)}/${id}/download`,
  overlay: (code: string, id: string, query = "") => `${scansBase(code)}/${id}/overlay${query ? `?${query}` : ""}`,
  coverage: (code: string, id: string, query = "") => `${scansBase(code)}/${id}/coverage${query ? `?${query}` : ""}`,
  similar: (code: string) => `/api/v1/stamps/${encodeURIComponent(code)}/similar`,
  /** POST a picture: search by picture (`?kind=print|face`). */
  byPicture: (kind?: "print" | "face") => `/api/v1/similar${kind ? `?kind=${kind}` : ""}`,
};

/** What GET …/scans answers: the scans, newest first, and this server's upload limits. */
export interface ScansAnswer {
  scans: ScanDto[];
  limits: { maxBytes: number; maxPixels: number };
}
