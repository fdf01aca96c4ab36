// GET /api/v1/admin/tokens — every user's live API tokens with their owners (admins)
import { apiRoute, methods } from "@/lib/api/route";
import { listAllApiTokens } from "@/lib/data/api-tokens";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listAllTokens", permission: "users:manage" }, async ({ actor }) => ({ tokens: await listAllApiTokens(actor) })),
});
