// GET /api/v1/stock-takes/{id} — progress and report of a count: missing, misplaced, unexpected
import { apiRoute, methods } from "@/lib/api/route";
import { getStockTake } from "@/lib/data/stamps/stock-takes";
import { stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getStockTake", permission: "data:read", params: stockTakeIdParamSchema }, async ({ actor, params }) => ({
    stockTake: await getStockTake(actor, params.id),
  })),
});
