// GET /api/v1/openapi.json — the OpenAPI 3.1 description of this API, built from the routes' own schemas
import { apiRoute, methods } from "@/lib/api/route";
import { openApiDocument } from "@/lib/api/openapi";
import { env } from "@/lib/env";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getOpenApi", permission: "data:read" }, async ({ t }) => {
    // Imported here, not at the top: the index imports this file too.
    const { routeModules } = await import("../route-index");
    return openApiDocument(routeModules, t, env().APP_URL);
  }),
});
