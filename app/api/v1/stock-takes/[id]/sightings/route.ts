// POST /api/v1/stock-takes/{id}/sightings — a stamp seen at a location (a typed code or a scanned label) (keepers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { recordSighting } from "@/lib/data/stamps/stock-takes";
import { sightingSchema, stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "recordSighting", permission: "stamps:write", params: stockTakeIdParamSchema, body: sightingSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ sighting: await recordSighting(actor, params.id, body) }),
  ),
});
