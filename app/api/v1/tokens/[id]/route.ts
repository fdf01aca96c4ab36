// DELETE /api/v1/tokens/{id} — revoke one of my API tokens
import { apiRoute, noContent, parseOrThrow } from "@/lib/api/route";
import { revokeApiToken } from "@/lib/data/api-tokens";
import { idParamSchema } from "@/lib/validation/users";

export const DELETE = apiRoute<{ id: string }>({ permission: "account:self" }, async ({ actor, params }) => {
  await revokeApiToken(actor, parseOrThrow(idParamSchema, params).id);
  return noContent();
});
