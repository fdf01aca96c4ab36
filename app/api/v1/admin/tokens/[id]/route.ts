// DELETE /api/v1/admin/tokens/{id} — revoke anyone's API token (admins)
import { apiRoute, noContent, parseOrThrow } from "@/lib/api/route";
import { revokeAnyApiToken } from "@/lib/data/api-tokens";
import { idParamSchema } from "@/lib/validation/users";

export const DELETE = apiRoute<{ id: string }>({ permission: "users:manage" }, async ({ actor, params }) => {
  await revokeAnyApiToken(actor, parseOrThrow(idParamSchema, params).id);
  return noContent();
});
