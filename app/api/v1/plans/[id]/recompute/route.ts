// POST /api/v1/plans/{id}/recompute — compute a plan's summary again from the stamps as they are now (planners)
import { apiRoute, methods } from "@/lib/api/route";
import { recomputePlan } from "@/lib/data/plans";
import { planIdParamSchema, planVersionSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "recomputePlan", permission: "plans:write", params: planIdParamSchema, body: planVersionSchema }, async ({ actor, params, body }) => ({
    plan: await recomputePlan(actor, params.id, body.version),
  })),
});
