// GET/DELETE /api/v1/stamps/{code}/scans/{id} — one scan; deleting removes its files from the store (keepers)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteScan, getScan } from "@/lib/data/scans";
import { scanIdParamSchema } from "@/lib/validation/scans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getScan", permission: "data:read", params: scanIdParamSchema }, async ({ actor, params }) => ({ scan: await getScan(actor, params.code, params.id) })),
  DELETE: apiRoute({ operation: "deleteScan", permission: "stamps:write", params: scanIdParamSchema, answers: { status: 204 } }, async ({ actor, params }) => {
    await deleteScan(actor, params.code, params.id);
    return noContent();
  }),
});
