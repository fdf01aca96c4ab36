// POST /api/v1/users/{id}/reset-link — e-mail the user a one-time password reset link (admins)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { sendPasswordResetFor } from "@/lib/data/users";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "sendPasswordReset", permission: "users:manage", params: idParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await sendPasswordResetFor(actor, params.id);
    return noContent();
  }),
});
