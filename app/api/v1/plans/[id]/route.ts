// GET/PATCH/DELETE /api/v1/plans/{id} — one cloth plan; changes need the version they start from (409 on a conflict)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deletePlan, getPlan, updatePlan } from "@/lib/data/plans";
import { planIdParamSchema, planVersionSchema, updatePlanSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getPlan", permission: "data:read", params: planIdParamSchema }, async ({ actor, params }) => ({ plan: await getPlan(actor, params.id) })),
  PATCH: apiRoute({ operation: "updatePlan", permission: "plans:write", params: planIdParamSchema, body: updatePlanSchema }, async ({ actor, params, body }) => ({
    plan: await updatePlan(actor, params.id, body),
  })),
  DELETE: apiRoute({ operation: "deletePlan", permission: "plans:write", params: planIdParamSchema, query: planVersionSchema, answers: { status: 204 } }, async ({ actor, params, query }) => {
    await deletePlan(actor, params.id, query.version);
    return noContent();
  }),
});
