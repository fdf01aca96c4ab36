// GET /api/v1/wax/recipes — recipes with their computed figures and temperature checks; POST — add one (wax masters)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createRecipe, listRecipes } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { createRecipeSchema, recipeListQuerySchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listWaxRecipes", permission: "data:read", query: recipeListQuerySchema }, async ({ actor, query, t }) => {
    const recipes = await listRecipes(actor, query);
    return withMessages({ recipes, total: recipes.length, page: 1, pageSize: recipes.length }, t);
  }),
  POST: apiRoute({ operation: "createWaxRecipe", permission: "wax:write", body: createRecipeSchema, answers: { status: 201 } }, async ({ actor, body, t }) =>
    created(withMessages({ recipe: await createRecipe(actor, body) }, t)),
  ),
});
