// GET /api/v1/stock-takes — the counts so far; POST — start counting the stamps of a site (keepers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { listStockTakes, startStockTake } from "@/lib/data/stamps/stock-takes";
import { startStockTakeSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listStockTakes", permission: "data:read" }, async ({ actor }) => ({ stockTakes: await listStockTakes(actor) })),
  POST: apiRoute({ operation: "startStockTake", permission: "stamps:write", body: startStockTakeSchema, answers: { status: 201 } }, async ({ actor, body }) =>
    created({ stockTake: await startStockTake(actor, body) }),
  ),
});
