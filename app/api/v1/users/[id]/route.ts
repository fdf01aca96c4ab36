// PATCH /api/v1/users/{id} — change a user's name, role or disabled flag (admins)
import { apiRoute, methods } from "@/lib/api/route";
import { updateUser } from "@/lib/data/users";
import { idParamSchema } from "@/lib/validation/common";
import { updateUserSchema } from "@/lib/validation/users";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  PATCH: apiRoute({ operation: "updateUser", permission: "users:manage", params: idParamSchema, body: updateUserSchema }, async ({ actor, params, body }) => ({
    user: await updateUser(actor, params.id, body),
  })),
});
