// GET /api/v1/users — list users; POST /api/v1/users — invite a user by e-mail (admins)
import { apiRoute, created, methods } from "@/lib/api/route";
import { inviteUser, listUsers } from "@/lib/data/users";
import { inviteUserSchema } from "@/lib/validation/users";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listUsers", permission: "users:manage" }, async ({ actor }) => ({ users: await listUsers(actor) })),
  POST: apiRoute({ operation: "inviteUser", permission: "users:manage", body: inviteUserSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ user: await inviteUser(actor, body) }),
  ),
});
