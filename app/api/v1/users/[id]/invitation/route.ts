// POST /api/v1/users/{id}/invitation — send a fresh invitation to a user who has not set a password (admins)
import { apiRoute, noContent, parseOrThrow } from "@/lib/api/route";
import { resendInvitation } from "@/lib/data/users";
import { idParamSchema } from "@/lib/validation/users";

export const POST = apiRoute<{ id: string }>({ permission: "users:manage" }, async ({ actor, params }) => {
  await resendInvitation(actor, parseOrThrow(idParamSchema, params).id);
  return noContent();
});
