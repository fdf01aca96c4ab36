// DELETE /api/v1/admin/tokens/{id} — revoke anyone's API token (admins)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { revokeAnyApiToken } from "@/lib/data/api-tokens";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  DELETE: apiRoute({ operation: "revokeAnyToken", permission: "users:manage", params: idParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await revokeAnyApiToken(actor, params.id);
    return noContent();
  }),
});
