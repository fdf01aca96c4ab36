// POST /api/v1/plans/{id}/duplicate — save a copy of a plan, computed afresh (planners)
import { apiRoute, created, methods } from "@/lib/api/route";
import { duplicatePlan } from "@/lib/data/plans";
import { duplicatePlanSchema, planIdParamSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute(
    { operation: "duplicatePlan", permission: "plans:write", params: planIdParamSchema, body: duplicatePlanSchema, bodyOptional: true, answers: { status: 201 } },
    async ({ actor, params, body }) => created({ plan: await duplicatePlan(actor, params.id, body.name) }),
  ),
});
