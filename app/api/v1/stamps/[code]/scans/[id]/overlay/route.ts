// GET /api/v1/stamps/{code}/scans/{id}/overlay?polarity=&threshold= — WebP picture of what counts as wax
import { apiRoute, methods } from "@/lib/api/route";
import { coverageOverlay } from "@/lib/data/scans";
import { coveragePreviewSchema, scanIdParamSchema } from "@/lib/validation/scans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute(
    { operation: "getCoverageOverlay", permission: "data:read", params: scanIdParamSchema, query: coveragePreviewSchema, answers: { type: "image/webp" } },
    async ({ actor, params, query }) => {
      const image = await coverageOverlay(actor, params.code, params.id, query);
      return new Response(new Uint8Array(image), { headers: { "content-type": "image/webp", "cache-control": "private, max-age=300", "x-content-type-options": "nosniff" } });
    },
  ),
});
