// GET /api/v1/new-stamp-requests — requests for new stamps (any signed-in user); POST — ask for a stamp of a size to be made
import { apiRoute, created, methods } from "@/lib/api/route";
import { createNewStampRequest, listNewStampRequests } from "@/lib/data/requests";
import { createNewStampRequestSchema, newStampRequestListQuerySchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listNewStampRequests", permission: "data:read", query: newStampRequestListQuerySchema }, async ({ actor, query }) => ({
    requests: await listNewStampRequests(actor, query),
  })),
  POST: apiRoute({ operation: "createNewStampRequest", permission: "stamps:requestNew", body: createNewStampRequestSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ request: await createNewStampRequest(actor, body) }),
  ),
});
