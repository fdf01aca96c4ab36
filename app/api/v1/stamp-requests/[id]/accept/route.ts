// POST /api/v1/stamp-requests/{id}/accept — keepers accept: every stamp checked out now in one transaction, or on the first day
import { apiRoute, methods } from "@/lib/api/route";
import { acceptStampRequest } from "@/lib/data/requests";
import { idParamSchema } from "@/lib/validation/common";
import { acceptRequestSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "acceptStampRequest", permission: "stamps:write", params: idParamSchema, body: acceptRequestSchema }, async ({ actor, params, body }) => ({
    request: await acceptStampRequest(actor, params.id, body.version),
  })),
});
