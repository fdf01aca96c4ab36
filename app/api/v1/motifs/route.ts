// GET /api/v1/motifs — the archive, filtered and paged (everyone); POST — add a motif with its stamp set and colourways (admins, keepers, designers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createMotif, listMotifs } from "@/lib/data/motifs";
import { createMotifSchema, motifListQuerySchema } from "@/lib/validation/motifs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listMotifs", permission: "data:read", query: motifListQuerySchema }, async ({ actor, query }) => listMotifs(actor, query)),
  POST: apiRoute({ operation: "createMotif", permission: "motifs:write", body: createMotifSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ motif: await createMotif(actor, body) }),
  ),
});
