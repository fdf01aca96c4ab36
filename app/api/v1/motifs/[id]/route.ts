// GET/PATCH/DELETE /api/v1/motifs/{id} — one motif with its stamps and their roles, colourways, history and past plans
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteMotif, getMotif, motifHistory, plansOfMotif, updateMotif } from "@/lib/data/motifs";
import { deleteQuerySchema, motifIdParamSchema, updateMotifSchema } from "@/lib/validation/motifs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getMotif", permission: "data:read", params: motifIdParamSchema }, async ({ actor, params }) => ({
    motif: await getMotif(actor, params.id),
    history: await motifHistory(actor, params.id),
    plans: await plansOfMotif(actor, params.id),
  })),
  PATCH: apiRoute({ operation: "updateMotif", permission: "motifs:write", params: motifIdParamSchema, body: updateMotifSchema }, async ({ actor, params, body }) => ({
    motif: await updateMotif(actor, params.id, body),
  })),
  DELETE: apiRoute({ operation: "deleteMotif", permission: "motifs:write", params: motifIdParamSchema, query: deleteQuerySchema, answers: { status: 204 } }, async ({ actor, params, query }) => {
    await deleteMotif(actor, params.id, query.version);
    return noContent();
  }),
});
