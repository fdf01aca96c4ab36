// POST /api/v1/stock-takes/{id}/end — close a count; its report stays readable (keepers)
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { endStockTake } from "@/lib/data/stock-takes";
import { stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ id: string }>({ permission: "stamps:write" }, async ({ actor, params }) => {
  const { id } = parseOrThrow(stockTakeIdParamSchema, params);
  return { stockTake: await endStockTake(actor, id) };
});
