// GET/PATCH/DELETE /api/v1/locations/{id} — one location; only an empty one can be deleted
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteLocation, getLocation, updateLocation } from "@/lib/data/stamps/locations";
import { locationIdParamSchema, updateLocationSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getLocation", permission: "data:read", params: locationIdParamSchema }, async ({ actor, params }) => ({
    location: await getLocation(actor, params.id),
  })),
  PATCH: apiRoute({ operation: "updateLocation", permission: "stamps:write", params: locationIdParamSchema, body: updateLocationSchema }, async ({ actor, params, body }) => ({
    location: await updateLocation(actor, params.id, body),
  })),
  DELETE: apiRoute({ operation: "deleteLocation", permission: "stamps:write", params: locationIdParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await deleteLocation(actor, params.id);
    return noContent();
  }),
});
