// GET /api/v1/admin/tokens — every user's live API tokens with their owners (admins)
import { apiRoute } from "@/lib/api/route";
import { listAllApiTokens } from "@/lib/data/api-tokens";

export const GET = apiRoute({ permission: "users:manage" }, async ({ actor }) => ({ tokens: await listAllApiTokens(actor) }));
