// GET /api/v1/stamps/{code}/scans/{id}/download — the original file (metadata stripped) as an attachment
import { apiRoute, methods } from "@/lib/api/route";
import { objectResponse } from "@/lib/api/object-response";
import { scanOriginal } from "@/lib/data/scans";
import { attachmentDisposition } from "@/lib/s3";
import { scanIdParamSchema } from "@/lib/validation/scans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute(
    { operation: "downloadScan", permission: "data:read", params: scanIdParamSchema, answers: { type: "application/octet-stream" } },
    async ({ actor, params }) => {
      const original = await scanOriginal(actor, params.code, params.id);
      return objectResponse(original, { "content-disposition": attachmentDisposition(original.fileName) });
    },
  ),
});
