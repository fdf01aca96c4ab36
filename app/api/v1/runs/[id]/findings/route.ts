// GET/POST /api/v1/runs/{id}/findings — a run's quality findings; record one (keepers, planners, wax masters, admins)
import { apiRoute, created, methods } from "@/lib/api/route";
import { listFindings, recordFinding } from "@/lib/data/runs";
import { idParamSchema } from "@/lib/validation/common";
import { recordFindingSchema } from "@/lib/validation/runs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listRunFindings", permission: "data:read", params: idParamSchema }, async ({ actor, params }) => ({ findings: await listFindings(actor, params.id) })),
  POST: apiRoute({ operation: "recordRunFinding", permission: "runs:recordFindings", params: idParamSchema, body: recordFindingSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created(await recordFinding(actor, params.id, body)),
  ),
});
