// GET /api/v1/stock-takes/{id} — progress and report of a count: missing, misplaced, unexpected
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { getStockTake } from "@/lib/data/stock-takes";
import { stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const GET = apiRoute<{ id: string }>({ permission: "data:read" }, async ({ actor, params }) => {
  const { id } = parseOrThrow(stockTakeIdParamSchema, params);
  return { stockTake: await getStockTake(actor, id) };
});
