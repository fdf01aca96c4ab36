// POST /api/v1/new-stamp-requests/{id}/stamp — keepers turn a request into the stamp record made from it (joins the motif's set)
import { apiRoute, created, methods } from "@/lib/api/route";
import { fulfilNewStampRequest } from "@/lib/data/requests";
import { idParamSchema } from "@/lib/validation/common";
import { fulfilNewStampRequestSchema } from "@/lib/validation/plans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "fulfilNewStampRequest", permission: "stamps:write", params: idParamSchema, body: fulfilNewStampRequestSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ request: await fulfilNewStampRequest(actor, params.id, body) }),
  ),
});
