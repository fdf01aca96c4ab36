// GET /api/v1/wax/materials/{id}/movements — a material's stock movements; POST — record a receipt, recovered wax or a correction (wax masters)
import { apiRoute, created, methods } from "@/lib/api/route";
import { listMovements, recordMovement } from "@/lib/data/wax";
import { idParamSchema } from "@/lib/validation/common";
import { stockMovementSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listWaxMovements", permission: "data:read", params: idParamSchema }, async ({ actor, params }) => {
    const movements = await listMovements(actor, params.id);
    return { movements, total: movements.length, page: 1, pageSize: movements.length };
  }),
  POST: apiRoute({ operation: "recordWaxMovement", permission: "wax:write", params: idParamSchema, body: stockMovementSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created(await recordMovement(actor, params.id, body)),
  ),
});
