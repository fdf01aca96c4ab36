// POST /api/v1/runs/{id}/stages/{stageId}/readings — record a pot temperature; answers the cautions it calls for (wax masters, admins)
import { apiRoute, created, methods } from "@/lib/api/route";
import { recordReading } from "@/lib/data/runs";
import { recordReadingSchema, runStageParamsSchema } from "@/lib/validation/runs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "recordRunReading", permission: "runs:recordWaxing", params: runStageParamsSchema, body: recordReadingSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ reading: await recordReading(actor, params.id, params.stageId, body) }),
  ),
});
