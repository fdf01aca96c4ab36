// GET /api/v1/wax/recipes/compare?a=&b= — two recipes side by side
import { apiRoute, methods } from "@/lib/api/route";
import { compareRecipes } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { recipeCompareQuerySchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "compareWaxRecipes", permission: "data:read", query: recipeCompareQuerySchema }, async ({ actor, query, t }) => withMessages(await compareRecipes(actor, query.a, query.b), t)),
});
