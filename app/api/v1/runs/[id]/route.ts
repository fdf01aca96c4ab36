// GET/PATCH/DELETE /api/v1/runs/{id} — one production run with its stages and totals; changes need the version they start from (409 on a conflict)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteRun, getRun, updateRun } from "@/lib/data/runs";
import { idParamSchema } from "@/lib/validation/common";
import { deleteRunQuerySchema, updateRunSchema } from "@/lib/validation/runs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getRun", permission: "data:read", params: idParamSchema }, async ({ actor, params }) => ({ run: await getRun(actor, params.id) })),
  PATCH: apiRoute({ operation: "updateRun", permission: "runs:write", params: idParamSchema, body: updateRunSchema }, async ({ actor, params, body }) => ({
    run: await updateRun(actor, params.id, body),
  })),
  DELETE: apiRoute({ operation: "deleteRun", permission: "runs:write", params: idParamSchema, query: deleteRunQuerySchema, answers: { status: 204 } }, async ({ actor, params, query }) => {
    await deleteRun(actor, params.id, query.version);
    return noContent();
  }),
});
