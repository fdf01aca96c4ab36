// GET /api/v1/stamps/{code}/scans/{id}/overlay?polarity=&threshold= — WebP picture of what counts as wax
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { coverageOverlay } from "@/lib/data/scans";
import { coveragePreviewSchema, scanIdParamSchema } from "@/lib/validation/scans";

export const GET = apiRoute<{ code: string; id: string }>({ permission: "data:read" }, async ({ actor, request, params }) => {
  const { code, id } = parseOrThrow(scanIdParamSchema, params);
  const query = parseOrThrow(coveragePreviewSchema, Object.fromEntries(new URL(request.url).searchParams));
  const image = await coverageOverlay(actor, code, id, query);
  return new Response(new Uint8Array(image), { headers: { "content-type": "image/webp", "cache-control": "private, max-age=300", "x-content-type-options": "nosniff" } });
});
