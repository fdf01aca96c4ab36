// GET /api/v1/plans/stamps?q= — library stamps for the planner by code or name, with thumbnail, size, condition and whether out
import { apiRoute, methods } from "@/lib/api/route";
import { searchPlanStamps } from "@/lib/data/plans";
import { planStampSearchSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "searchPlanStamps", permission: "data:read", query: planStampSearchSchema }, async ({ actor, query }) => ({ stamps: await searchPlanStamps(actor, query.q ?? "", query.limit) })),
});
