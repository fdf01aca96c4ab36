// DELETE /api/v1/stock-takes/{id}/sightings/{code} — undo a mistaken sighting while the count is open (keepers)
import { apiRoute, noContent, parseOrThrow } from "@/lib/api/route";
import { removeSighting } from "@/lib/data/stock-takes";
import { stampCodeSchema, stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const DELETE = apiRoute<{ id: string; code: string }>({ permission: "stamps:write" }, async ({ actor, params }) => {
  const { id, code } = parseOrThrow(stockTakeIdParamSchema.extend({ code: stampCodeSchema }), params);
  await removeSighting(actor, id, code);
  return noContent();
});
