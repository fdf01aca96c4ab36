// DELETE /api/v1/stock-takes/{id}/sightings/{code} — undo a mistaken sighting while the count is open (keepers)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { removeSighting } from "@/lib/data/stamps/stock-takes";
import { sightingParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  DELETE: apiRoute({ operation: "removeSighting", permission: "stamps:write", params: sightingParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await removeSighting(actor, params.id, params.code);
    return noContent();
  }),
});
