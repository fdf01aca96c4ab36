// GET /api/v1/wax/uses — recorded wax uses, newest first; POST — record what a waxing used (wax masters)
import { apiRoute, created, methods } from "@/lib/api/route";
import { listWaxUses, recordWaxUse } from "@/lib/data/wax";
import { recordWaxUseSchema, waxUseListQuerySchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listWaxUses", permission: "data:read", query: waxUseListQuerySchema }, async ({ actor, query }) => {
    const uses = await listWaxUses(actor, query);
    return { uses, total: uses.length, page: 1, pageSize: uses.length };
  }),
  POST: apiRoute({ operation: "recordWaxUse", permission: "wax:write", body: recordWaxUseSchema, answers: { status: 201 } }, async ({ actor, body }) => created({ use: await recordWaxUse(actor, body) })),
});
