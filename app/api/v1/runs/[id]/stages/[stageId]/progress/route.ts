// POST /api/v1/runs/{id}/stages/{stageId}/progress — record a day's work at a stage (waxing and boil-off: wax masters; dye and bleach: planners; admins both)
import { apiRoute, created, methods } from "@/lib/api/route";
import { recordProgress } from "@/lib/data/runs";
import { recordProgressSchema, runStageParamsSchema } from "@/lib/validation/runs";

// The route lets every reader in: which permission applies depends on the stage's kind, which the data layer
// reads and checks (runs:recordWaxing or runs:write) before anything is written.
export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "recordRunProgress", permission: "data:read", params: runStageParamsSchema, body: recordProgressSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ run: await recordProgress(actor, params.id, params.stageId, body) }),
  ),
});
