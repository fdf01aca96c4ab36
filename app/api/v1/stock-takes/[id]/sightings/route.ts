// POST /api/v1/stock-takes/{id}/sightings — a stamp seen at a location (a typed code or a scanned label) (keepers)
import { apiRoute, created, parseOrThrow, readJson } from "@/lib/api/route";
import { recordSighting } from "@/lib/data/stock-takes";
import { sightingSchema, stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ id: string }>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { id } = parseOrThrow(stockTakeIdParamSchema, params);
  const input = await readJson(request, sightingSchema);
  return created({ sighting: await recordSighting(actor, id, input) });
});
