// GET /api/v1/me — who am I: the signed-in user (session or API token) and what their role may do
import { apiRoute, methods } from "@/lib/api/route";
import { permissionsOf } from "@/lib/permissions";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getMe", permission: "account:self" }, async ({ actor }) => ({
    id: actor.id,
    email: actor.email,
    name: actor.name,
    role: actor.role,
    unitSystem: actor.unitSystem,
    locale: actor.locale,
    permissions: permissionsOf(actor.role),
    via: actor.via,
  })),
});
