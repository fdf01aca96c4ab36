// GET /api/v1/wax/materials/{id}/history — who changed which figure of a material, and when
import { apiRoute, methods } from "@/lib/api/route";
import { materialHistory } from "@/lib/data/wax";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxMaterialHistory", permission: "data:read", params: idParamSchema }, async ({ actor, params }) => ({ history: await materialHistory(actor, params.id) })),
});
