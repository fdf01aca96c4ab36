// POST /api/v1/new-stamp-requests/{id}/decline — keepers decline a new-stamp request with a reason
import { apiRoute, methods } from "@/lib/api/route";
import { declineNewStampRequest } from "@/lib/data/requests";
import { idParamSchema } from "@/lib/validation/common";
import { declineRequestSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "declineNewStampRequest", permission: "stamps:write", params: idParamSchema, body: declineRequestSchema }, async ({ actor, params, body }) => ({
    request: await declineNewStampRequest(actor, params.id, body),
  })),
});
