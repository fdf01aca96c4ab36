// GET /api/v1/plans/{id}/history — who created, changed, renamed, recomputed or copied a plan (any signed-in user)
import { apiRoute, methods } from "@/lib/api/route";
import { planHistory } from "@/lib/data/plans";
import { planIdParamSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getPlanHistory", permission: "data:read", params: planIdParamSchema }, async ({ actor, params }) => ({ history: await planHistory(actor, params.id) })),
});
