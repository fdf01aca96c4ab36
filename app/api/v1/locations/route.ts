// GET /api/v1/locations — every site's locations with their stamp counts; POST — add a location (keepers)
import { apiRoute, created, readJson } from "@/lib/api/route";
import { createLocation, listLocations } from "@/lib/data/locations";
import { locationSchema } from "@/lib/validation/stamps";

export const GET = apiRoute({ permission: "data:read" }, async ({ actor }) => ({ locations: await listLocations(actor) }));

export const POST = apiRoute({ permission: "stamps:write" }, async ({ actor, request }) => {
  const input = await readJson(request, locationSchema);
  return created({ location: await createLocation(actor, input) });
});
