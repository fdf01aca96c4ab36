// DELETE /api/v1/tokens/{id} — revoke one of my API tokens
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { revokeApiToken } from "@/lib/data/api-tokens";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  DELETE: apiRoute({ operation: "revokeMyToken", permission: "account:self", params: idParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await revokeApiToken(actor, params.id);
    return noContent();
  }),
});
