// POST /api/v1/users/{id}/invitation — send a fresh invitation to a user who has not set a password (admins)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { resendInvitation } from "@/lib/data/users";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "resendInvitation", permission: "users:manage", params: idParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await resendInvitation(actor, params.id);
    return noContent();
  }),
});
