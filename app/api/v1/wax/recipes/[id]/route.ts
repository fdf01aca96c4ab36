// GET/PATCH/DELETE /api/v1/wax/recipes/{id} — one recipe; changes need the version they start from (409); a recipe in use is archived, not deleted
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteRecipe, getRecipe, updateRecipe } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { idParamSchema } from "@/lib/validation/common";
import { deleteQuerySchema, updateRecipeSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxRecipe", permission: "data:read", params: idParamSchema }, async ({ actor, params, t }) => withMessages({ recipe: await getRecipe(actor, params.id) }, t)),
  PATCH: apiRoute({ operation: "updateWaxRecipe", permission: "wax:write", params: idParamSchema, body: updateRecipeSchema }, async ({ actor, params, body, t }) =>
    withMessages({ recipe: await updateRecipe(actor, params.id, body) }, t),
  ),
  DELETE: apiRoute({ operation: "deleteWaxRecipe", permission: "wax:write", params: idParamSchema, query: deleteQuerySchema, answers: { status: 204 } }, async ({ actor, params, query }) => {
    await deleteRecipe(actor, params.id, query.version);
    return noContent();
  }),
});
