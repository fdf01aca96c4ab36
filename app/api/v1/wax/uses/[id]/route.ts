// GET /api/v1/wax/uses/{id} — one recorded wax use
import { apiRoute, methods } from "@/lib/api/route";
import { getWaxUse } from "@/lib/data/wax";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxUse", permission: "data:read", params: idParamSchema }, async ({ actor, params }) => ({ use: await getWaxUse(actor, params.id) })),
});
