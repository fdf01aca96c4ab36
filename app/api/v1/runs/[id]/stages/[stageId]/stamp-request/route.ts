// POST /api/v1/runs/{id}/stages/{stageId}/stamp-request — ask the keepers for a waxing stage's stamps for its days (whoever may request stamps)
import { apiRoute, created, methods } from "@/lib/api/route";
import { requestStageStamps } from "@/lib/data/runs";
import { runStageParamsSchema, stageStampRequestSchema } from "@/lib/validation/runs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "requestRunStageStamps", permission: "stamps:request", params: runStageParamsSchema, body: stageStampRequestSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ request: await requestStageStamps(actor, params.id, params.stageId, body) }),
  ),
});
