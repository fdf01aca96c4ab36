// POST /api/v1/stock-takes/{id}/end — close a count; its report stays readable (keepers)
import { apiRoute, methods } from "@/lib/api/route";
import { endStockTake } from "@/lib/data/stamps/stock-takes";
import { stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "endStockTake", permission: "stamps:write", params: stockTakeIdParamSchema }, async ({ actor, params }) => ({
    stockTake: await endStockTake(actor, params.id),
  })),
});
