// GET /api/v1/stamps/{code}/scans/{id}/image?size=thumb|large — a WebP view of the scan (256 or 1024 px)
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { objectResponse } from "@/lib/api/scan-route";
import { scanImage } from "@/lib/data/scans";
import { scanIdParamSchema, scanImageQuerySchema } from "@/lib/validation/scans";

export const GET = apiRoute<{ code: string; id: string }>({ permission: "data:read" }, async ({ actor, request, params }) => {
  const { code, id } = parseOrThrow(scanIdParamSchema, params);
  const { size } = parseOrThrow(scanImageQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  return objectResponse(await scanImage(actor, code, id, size));
});
