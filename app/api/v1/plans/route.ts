// GET /api/v1/plans — list cloth plans (search, filters, sort, pages); POST /api/v1/plans — save a plan (planners)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createPlan, listPlans } from "@/lib/data/plans";
import { createPlanSchema, planListQuerySchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listPlans", permission: "data:read", query: planListQuerySchema }, async ({ actor, query }) => listPlans(actor, query)),
  POST: apiRoute({ operation: "createPlan", permission: "plans:write", body: createPlanSchema, answers: { status: 201 } }, async ({ actor, body }) => created({ plan: await createPlan(actor, body) })),
});
