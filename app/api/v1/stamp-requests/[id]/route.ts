// GET /api/v1/stamp-requests/{id} — one check-out request and its stamps (any signed-in user)
import { apiRoute, methods } from "@/lib/api/route";
import { getStampRequest } from "@/lib/data/requests";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getStampRequest", permission: "data:read", params: idParamSchema }, async ({ actor, params }) => ({ request: await getStampRequest(actor, params.id) })),
});
