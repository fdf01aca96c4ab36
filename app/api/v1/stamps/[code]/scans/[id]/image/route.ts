// GET /api/v1/stamps/{code}/scans/{id}/image?size=thumb|large — a WebP view of the scan (256 or 1024 px)
import { apiRoute, methods } from "@/lib/api/route";
import { objectResponse } from "@/lib/api/object-response";
import { scanImage } from "@/lib/data/scans";
import { scanIdParamSchema, scanImageQuerySchema } from "@/lib/validation/scans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute(
    { operation: "getScanImage", permission: "data:read", params: scanIdParamSchema, query: scanImageQuerySchema, answers: { type: "image/webp" } },
    async ({ actor, params, query }) => objectResponse(await scanImage(actor, params.code, params.id, query.size)),
  ),
});
