// GET/PATCH/DELETE /api/v1/wax/estimates/{id} — one saved estimate; rename it or mark it planned, or delete it (wax masters)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteEstimate, getEstimate, updateEstimate } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { idParamSchema } from "@/lib/validation/common";
import { deleteQuerySchema, updateEstimateSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxEstimate", permission: "data:read", params: idParamSchema }, async ({ actor, params, t }) => withMessages({ estimate: await getEstimate(actor, params.id) }, t)),
  PATCH: apiRoute({ operation: "updateWaxEstimate", permission: "wax:write", params: idParamSchema, body: updateEstimateSchema }, async ({ actor, params, body, t }) =>
    withMessages({ estimate: await updateEstimate(actor, params.id, body) }, t),
  ),
  DELETE: apiRoute({ operation: "deleteWaxEstimate", permission: "wax:write", params: idParamSchema, query: deleteQuerySchema, answers: { status: 204 } }, async ({ actor, params, query }) => {
    await deleteEstimate(actor, params.id, query.version);
    return noContent();
  }),
});
