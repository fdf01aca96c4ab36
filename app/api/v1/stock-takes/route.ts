// GET /api/v1/stock-takes — the counts so far; POST — start counting the stamps of a site (keepers)
import { apiRoute, created, readJson } from "@/lib/api/route";
import { listStockTakes, startStockTake } from "@/lib/data/stock-takes";
import { startStockTakeSchema } from "@/lib/validation/stamps";

export const GET = apiRoute({ permission: "data:read" }, async ({ actor }) => ({ stockTakes: await listStockTakes(actor) }));

export const POST = apiRoute({ permission: "stamps:write" }, async ({ actor, request }) => {
  const input = await readJson(request, startStockTakeSchema);
  return created({ stockTake: await startStockTake(actor, input) });
});
