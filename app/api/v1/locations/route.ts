// GET /api/v1/locations — every site's locations with their stamp counts; POST — add a location (keepers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createLocation, listLocations } from "@/lib/data/stamps/locations";
import { locationSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listLocations", permission: "data:read" }, async ({ actor }) => ({ locations: await listLocations(actor) })),
  POST: apiRoute({ operation: "createLocation", permission: "stamps:write", body: locationSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ location: await createLocation(actor, body) }),
  ),
});
