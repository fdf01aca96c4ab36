// GET /api/v1/stamp-requests — check-out requests (any signed-in user); POST — ask the keepers for stamps (any role)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createStampRequest, listStampRequests } from "@/lib/data/requests";
import { createStampRequestSchema, stampRequestListQuerySchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listStampRequests", permission: "data:read", query: stampRequestListQuerySchema }, async ({ actor, query }) => ({ requests: await listStampRequests(actor, query) })),
  POST: apiRoute({ operation: "createStampRequest", permission: "stamps:request", body: createStampRequestSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ request: await createStampRequest(actor, body) }),
  ),
});
