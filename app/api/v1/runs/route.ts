// GET /api/v1/runs — list production runs (words, state, motif, sort, pages); POST /api/v1/runs — start a run (planners, admins)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createRun, listRuns } from "@/lib/data/runs";
import { createRunSchema, runListQuerySchema } from "@/lib/validation/runs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listRuns", permission: "data:read", query: runListQuerySchema }, async ({ actor, query }) => listRuns(actor, query)),
  POST: apiRoute({ operation: "createRun", permission: "runs:write", body: createRunSchema, answers: { status: 201 } }, async ({ actor, body }) => created({ run: await createRun(actor, body) })),
});
