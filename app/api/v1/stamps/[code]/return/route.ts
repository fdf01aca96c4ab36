// POST /api/v1/stamps/{code}/return — take a checked-out stamp back (keepers)
import { apiRoute, methods } from "@/lib/api/route";
import { returnStamp } from "@/lib/data/stamps";
import { returnSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "returnStamp", permission: "stamps:write", params: stampCodeParamSchema, body: returnSchema, bodyOptional: true }, async ({ actor, params, body }) => ({
    return: await returnStamp(actor, params.code, body),
  })),
});
