// GET /api/v1/wax/estimates — saved estimates (?planned=true for the planned work); POST — save one (wax masters)
import { apiRoute, created, methods } from "@/lib/api/route";
import { listEstimates, saveEstimate } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { estimateListQuerySchema, saveEstimateSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listWaxEstimates", permission: "data:read", query: estimateListQuerySchema }, async ({ actor, query, t }) => {
    const estimates = await listEstimates(actor, query);
    return withMessages({ estimates, total: estimates.length, page: 1, pageSize: estimates.length }, t);
  }),
  POST: apiRoute({ operation: "saveWaxEstimate", permission: "wax:write", body: saveEstimateSchema, answers: { status: 201 } }, async ({ actor, body, t }) =>
    created(withMessages({ estimate: await saveEstimate(actor, body) }, t)),
  ),
});
