// GET /api/v1/wax/recipes/{id}/history — who changed what in a recipe, and when
import { apiRoute, methods } from "@/lib/api/route";
import { recipeHistory } from "@/lib/data/wax";
import { idParamSchema } from "@/lib/validation/common";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxRecipeHistory", permission: "data:read", params: idParamSchema }, async ({ actor, params }) => ({ history: await recipeHistory(actor, params.id) })),
});
