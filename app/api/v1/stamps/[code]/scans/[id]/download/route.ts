// GET /api/v1/stamps/{code}/scans/{id}/download — the original file (metadata stripped) as an attachment
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { objectResponse } from "@/lib/api/scan-route";
import { scanOriginal } from "@/lib/data/scans";
import { attachmentDisposition } from "@/lib/s3";
import { scanIdParamSchema } from "@/lib/validation/scans";

export const GET = apiRoute<{ code: string; id: string }>({ permission: "data:read" }, async ({ actor, params }) => {
  const { code, id } = parseOrThrow(scanIdParamSchema, params);
  const original = await scanOriginal(actor, code, id);
  return objectResponse(original, { "content-disposition": attachmentDisposition(original.fileName) });
});
