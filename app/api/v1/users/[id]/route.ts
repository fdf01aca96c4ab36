// PATCH /api/v1/users/{id} — change a user's name, role or disabled flag (admins)
import { apiRoute, parseOrThrow, readJson } from "@/lib/api/route";
import { updateUser } from "@/lib/data/users";
import { idParamSchema, updateUserSchema } from "@/lib/validation/users";

export const PATCH = apiRoute<{ id: string }>({ permission: "users:manage" }, async ({ actor, request, params }) => {
  const { id } = parseOrThrow(idParamSchema, params);
  const patch = await readJson(request, updateUserSchema);
  return { user: await updateUser(actor, id, patch) };
});
