// GET /api/v1/wax/materials — materials with their figures, sources and stock on hand; POST — add one (wax masters)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createMaterial, listMaterials } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { createMaterialSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listWaxMaterials", permission: "data:read" }, async ({ actor }) => {
    const materials = await listMaterials(actor);
    return { materials, total: materials.length, page: 1, pageSize: materials.length };
  }),
  POST: apiRoute({ operation: "createWaxMaterial", permission: "wax:write", body: createMaterialSchema, answers: { status: 201 } }, async ({ actor, body, t }) =>
    created(withMessages({ material: await createMaterial(actor, body) }, t)),
  ),
});
