// POST /api/v1/layout — compute a repeat layout without saving it (any signed-in user)
import { apiRoute, readJson } from "@/lib/api/route";
import { computeLayoutFor } from "@/lib/data/layout";
import { layoutRequestSchema } from "@/lib/validation/layout";

export const POST = apiRoute({ permission: "data:read" }, async ({ actor, request }) => {
  const body = await readJson(request, layoutRequestSchema);
  return computeLayoutFor(actor, body);
});
