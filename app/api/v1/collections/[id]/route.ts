// GET/PATCH/DELETE /api/v1/collections/{id} — one collection; only an empty one can be deleted
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteCollection, getCollection, updateCollection } from "@/lib/data/motifs";
import { motifIdParamSchema, updateCollectionSchema } from "@/lib/validation/motifs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getCollection", permission: "data:read", params: motifIdParamSchema }, async ({ actor, params }) => ({
    collection: await getCollection(actor, params.id),
  })),
  PATCH: apiRoute({ operation: "updateCollection", permission: "motifs:write", params: motifIdParamSchema, body: updateCollectionSchema }, async ({ actor, params, body }) => ({
    collection: await updateCollection(actor, params.id, body),
  })),
  DELETE: apiRoute({ operation: "deleteCollection", permission: "motifs:write", params: motifIdParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await deleteCollection(actor, params.id);
    return noContent();
  }),
});
