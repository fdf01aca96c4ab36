// GET /api/v1/tokens — my API tokens; POST /api/v1/tokens — create one (the secret is shown once)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createApiToken, listApiTokens } from "@/lib/data/api-tokens";
import { createApiTokenSchema } from "@/lib/validation/users";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listMyTokens", permission: "account:self" }, async ({ actor }) => ({ tokens: await listApiTokens(actor) })),
  POST: apiRoute({ operation: "createToken", permission: "account:self", body: createApiTokenSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ token: await createApiToken(actor, body.name) }),
  ),
});
