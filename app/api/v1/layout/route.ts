// POST /api/v1/layout — compute a repeat layout without saving it (any signed-in user)
import { apiRoute, methods } from "@/lib/api/route";
import { computeLayoutFor } from "@/lib/data/layout";
import { layoutRequestSchema } from "@/lib/validation/layout";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "computeLayout", permission: "data:read", body: layoutRequestSchema }, async ({ actor, body }) => computeLayoutFor(actor, body)),
});
