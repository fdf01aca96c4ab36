// GET/PATCH/DELETE /api/v1/locations/{id} — one location; only an empty one can be deleted
import { apiRoute, noContent, parseOrThrow, readJson } from "@/lib/api/route";
import { deleteLocation, getLocation, updateLocation } from "@/lib/data/locations";
import { locationIdParamSchema, updateLocationSchema } from "@/lib/validation/stamps";

type Params = { id: string };

export const GET = apiRoute<Params>({ permission: "data:read" }, async ({ actor, params }) => {
  const { id } = parseOrThrow(locationIdParamSchema, params);
  return { location: await getLocation(actor, id) };
});

export const PATCH = apiRoute<Params>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { id } = parseOrThrow(locationIdParamSchema, params);
  const patch = await readJson(request, updateLocationSchema);
  return { location: await updateLocation(actor, id, patch) };
});

export const DELETE = apiRoute<Params>({ permission: "stamps:write" }, async ({ actor, params }) => {
  const { id } = parseOrThrow(locationIdParamSchema, params);
  await deleteLocation(actor, id);
  return noContent();
});
