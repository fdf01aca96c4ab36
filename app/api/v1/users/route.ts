// GET /api/v1/users — list users; POST /api/v1/users — invite a user by e-mail (admins)
import { apiRoute, created, readJson } from "@/lib/api/route";
import { inviteUser, listUsers } from "@/lib/data/users";
import { inviteUserSchema } from "@/lib/validation/users";

export const GET = apiRoute({ permission: "users:manage" }, async ({ actor }) => ({ users: await listUsers(actor) }));

export const POST = apiRoute({ permission: "users:manage" }, async ({ actor, request }) => {
  const input = await readJson(request, inviteUserSchema);
  return created({ user: await inviteUser(actor, input) });
});
