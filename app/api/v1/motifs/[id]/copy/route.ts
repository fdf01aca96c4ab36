// POST /api/v1/motifs/{id}/copy — copy as a new design, linked to the original (admins, keepers, designers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { copyMotif } from "@/lib/data/motifs";
import { copyMotifSchema, motifIdParamSchema } from "@/lib/validation/motifs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "copyMotif", permission: "motifs:write", params: motifIdParamSchema, body: copyMotifSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ motif: await copyMotif(actor, params.id, body.name) }),
  ),
});
