// GET/PATCH /api/v1/wax/materials/{id} — one material; a change needs its version (409) and re-checks the recipes using it
import { apiRoute, methods } from "@/lib/api/route";
import { getMaterial, updateMaterial } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { idParamSchema } from "@/lib/validation/common";
import { updateMaterialSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxMaterial", permission: "data:read", params: idParamSchema }, async ({ actor, params, t }) => withMessages({ material: await getMaterial(actor, params.id) }, t)),
  PATCH: apiRoute({ operation: "updateWaxMaterial", permission: "wax:write", params: idParamSchema, body: updateMaterialSchema }, async ({ actor, params, body, t }) =>
    withMessages(await updateMaterial(actor, params.id, body), t),
  ),
});
