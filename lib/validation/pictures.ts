import { z } from "@/lib/zod";

// Inputs of the picture routes (a new-stamp request's sketch, a run finding's photo). The picture itself is the
// body and is checked by lib/scans; the name is for display only (lib/scans refuses path tricks and hidden characters).

const fileName = z.string("validation.required").trim().min(1, "validation.required").max(1000, "validation.tooLong");

/** PUT …/sketch, PUT …/photo: the name the file came with, optional. */
export const pictureUploadQuerySchema = z.object({ fileName: fileName.optional() }).strict();

/** GET …/sketch, GET …/photo: the original (as stored, metadata stripped) or its WebP thumbnail. */
export const pictureVariantQuerySchema = z.object({ variant: z.enum(["original", "thumb"], "validation.invalidOption").default("original") }).strict();

/** /api/v1/runs/{id}/findings/{findingId}/… */
export const findingParamSchema = z.object({ id: z.uuid("validation.notFound"), findingId: z.uuid("validation.notFound") });
