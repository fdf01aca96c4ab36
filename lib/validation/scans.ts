import { z } from "@/lib/zod";
import { stampCodeSchema } from "./stamps";

// Inputs of the scan routes (app/api/v1/stamps/[code]/scans/…), shared by the routes, the uploader and the tests.

export const scanKinds = ["face", "print"] as const;
export type ScanKindValue = (typeof scanKinds)[number];
export const waxPolarityValues = ["darkIsWax", "lightIsWax"] as const;

/** A wax print on white cloth is dark wax on light; a photo of the copper face shows the strips light on dark. */
export const polarityForKind: Record<ScanKindValue, (typeof waxPolarityValues)[number]> = { print: "darkIsWax", face: "lightIsWax" };

/** Lowest and highest resolution a keeper may enter (the same range lib/scans accepts). */
export const DPI_MIN = 10;
export const DPI_MAX = 20_000;

export const scanIdParamSchema = z.object({ code: stampCodeSchema, id: z.uuid("validation.notFound") });

const fileName = z.string("validation.required").min(1, "validation.required").max(1000, "validation.tooLong");

/** Step 1: ask for a presigned PUT for a file of `sizeBytes` (the claimed size; checked again after upload). */
export const presignScanSchema = z
  .object({
    fileName,
    sizeBytes: z.number("validation.number").int("validation.wholeNumber").min(0, "validation.tooSmall"),
  })
  .strict();

export const dpiSchema = z.number("validation.number").min(DPI_MIN, "validation.scanDpi").max(DPI_MAX, "validation.scanDpi");

/** Step 2: the file is in the store under `uploadKey`; check it, measure it and keep it. */
export const completeScanSchema = z
  .object({
    uploadKey: z.string("validation.required").regex(/^uploads\/[0-9a-f-]{36}\/[0-9a-f-]{36}\/[0-9a-f-]{36}$/, "validation.scanUploadKey"),
    fileName,
    kind: z.enum(scanKinds, "validation.invalidOption"),
    /** The keeper's resolution, when the file has none (or a wrong one). */
    dpi: dpiSchema.nullable().optional(),
  })
  .strict();

const threshold = z.coerce.number("validation.number").int("validation.wholeNumber").min(0, "validation.scanThreshold").max(255, "validation.scanThreshold");

/** Query of the live coverage preview; no threshold = Otsu's. */
export const coveragePreviewSchema = z.object({
  polarity: z.enum(waxPolarityValues, "validation.invalidOption"),
  threshold: threshold.optional(),
});

/** Saving a reviewed coverage to the stamp; the server measures again, so the ratio is never taken from the client. */
export const saveCoverageSchema = z
  .object({
    polarity: z.enum(waxPolarityValues, "validation.invalidOption"),
    threshold: z.number("validation.number").int("validation.wholeNumber").min(0, "validation.scanThreshold").max(255, "validation.scanThreshold"),
  })
  .strict();

export const scanImageSizes = ["thumb", "large"] as const;
export const scanImageQuerySchema = z.object({ size: z.enum(scanImageSizes, "validation.invalidOption").default("thumb") });

/** Query of search by picture: what the picture shows (a face photo is the mirror image of its print). */
export const similarQuerySchema = z.object({ kind: z.enum(scanKinds, "validation.invalidOption").optional() }).strict();

export type PresignScanInput = z.infer<typeof presignScanSchema>;
export type CompleteScanInput = z.infer<typeof completeScanSchema>;
export type CoveragePreviewInput = z.infer<typeof coveragePreviewSchema>;
export type SaveCoverageInput = z.infer<typeof saveCoverageSchema>;
