// POST /api/v1/stock-takes/{id}/relocate — move every misplaced or stray stamp to where the count saw it (keepers)
import { apiRoute, methods } from "@/lib/api/route";
import { relocateFound } from "@/lib/data/stamps/stock-takes";
import { stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "relocateFoundStamps", permission: "stamps:write", params: stockTakeIdParamSchema }, async ({ actor, params }) => relocateFound(actor, params.id)),
});
