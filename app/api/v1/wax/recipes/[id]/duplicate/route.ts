// POST /api/v1/wax/recipes/{id}/duplicate — copy a recipe under a new name, e.g. into the season's variant (wax masters)
import { apiRoute, created, methods } from "@/lib/api/route";
import { duplicateRecipe } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { idParamSchema } from "@/lib/validation/common";
import { duplicateRecipeSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "duplicateWaxRecipe", permission: "wax:write", params: idParamSchema, body: duplicateRecipeSchema, answers: { status: 201 } }, async ({ actor, params, body, t }) =>
    created(withMessages({ recipe: await duplicateRecipe(actor, params.id, body) }, t)),
  ),
});
