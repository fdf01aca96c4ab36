// POST /api/v1/stock-takes/{id}/relocate — move every misplaced or stray stamp to where the count saw it (keepers)
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { relocateFound } from "@/lib/data/stock-takes";
import { stockTakeIdParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ id: string }>({ permission: "stamps:write" }, async ({ actor, params }) => {
  const { id } = parseOrThrow(stockTakeIdParamSchema, params);
  return relocateFound(actor, id);
});
