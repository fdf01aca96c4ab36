// POST /api/v1/users/{id}/reset-link — e-mail the user a one-time password reset link (admins)
import { apiRoute, noContent, parseOrThrow } from "@/lib/api/route";
import { sendPasswordResetFor } from "@/lib/data/users";
import { idParamSchema } from "@/lib/validation/users";

export const POST = apiRoute<{ id: string }>({ permission: "users:manage" }, async ({ actor, params }) => {
  await sendPasswordResetFor(actor, parseOrThrow(idParamSchema, params).id);
  return noContent();
});
