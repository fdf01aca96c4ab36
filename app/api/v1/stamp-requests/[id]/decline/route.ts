// POST /api/v1/stamp-requests/{id}/decline — keepers decline a check-out request with a reason
import { apiRoute, methods } from "@/lib/api/route";
import { declineStampRequest } from "@/lib/data/requests";
import { idParamSchema } from "@/lib/validation/common";
import { declineRequestSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "declineStampRequest", permission: "stamps:write", params: idParamSchema, body: declineRequestSchema }, async ({ actor, params, body }) => ({
    request: await declineStampRequest(actor, params.id, body),
  })),
});
