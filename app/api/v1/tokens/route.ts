// GET /api/v1/tokens — my API tokens; POST /api/v1/tokens — create one (the secret is shown once)
import { apiRoute, created, readJson } from "@/lib/api/route";
import { createApiToken, listApiTokens } from "@/lib/data/api-tokens";
import { createApiTokenSchema } from "@/lib/validation/users";

export const GET = apiRoute({ permission: "account:self" }, async ({ actor }) => ({ tokens: await listApiTokens(actor) }));

export const POST = apiRoute({ permission: "account:self" }, async ({ actor, request }) => {
  const { name } = await readJson(request, createApiTokenSchema);
  return created({ token: await createApiToken(actor, name) });
});
