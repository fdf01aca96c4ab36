// POST /api/v1/similar — stamps and motifs that look like the picture in the body (PNG, JPEG or WebP; ?kind=print|face) (everyone signed in)
import { readBodyBytes } from "@/lib/api/body";
import { apiRoute, methods } from "@/lib/api/route";
import { scanLimits, similarToPicture } from "@/lib/data/scans";
import { similarQuerySchema } from "@/lib/validation/scans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "findSimilarToPicture", permission: "data:read", query: similarQuerySchema, accepts: "image/*" }, async ({ actor, request, query }) => {
    const bytes = await readBodyBytes(request, scanLimits().maxBytes);
    const matches = await similarToPicture(actor, bytes, { kind: query.kind });
    return { matches: matches.map(({ stampCode, motifId, distance, mirrored, stampName, scanId, close, urls }) => ({ stampCode, motifId, distance, mirrored, stampName, scanId, close, urls })) };
  }),
});
