// GET /api/v1/collections — every collection with its motif count (everyone); POST — add one (admins, keepers, designers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createCollection, listCollections } from "@/lib/data/motifs";
import { collectionSchema } from "@/lib/validation/motifs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listCollections", permission: "data:read" }, async ({ actor }) => ({ collections: await listCollections(actor) })),
  POST: apiRoute({ operation: "createCollection", permission: "motifs:write", body: collectionSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ collection: await createCollection(actor, body) }),
  ),
});
