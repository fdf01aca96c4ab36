// POST /api/v1/stamps/{code}/condition — move a stamp along its repair path or retire it (keepers)
import { apiRoute, methods } from "@/lib/api/route";
import { changeCondition } from "@/lib/data/stamps";
import { conditionChangeSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "changeStampCondition", permission: "stamps:write", params: stampCodeParamSchema, body: conditionChangeSchema }, async ({ actor, params, body }) => ({
    stamp: await changeCondition(actor, params.code, body),
  })),
});
