// POST /api/v1/wax/uses/{id}/withdraw — withdraw a mistaken wax use: its wax back into stock, its impressions back, out of the calibration (wax masters)
import { apiRoute, methods } from "@/lib/api/route";
import { withdrawWaxUse } from "@/lib/data/wax";
import { idParamSchema } from "@/lib/validation/common";
import { withdrawWaxUseSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "withdrawWaxUse", permission: "wax:write", params: idParamSchema, body: withdrawWaxUseSchema }, async ({ actor, params, body }) => ({ use: await withdrawWaxUse(actor, params.id, body) })),
});
