// GET /api/v1/stamps — list stamps (search, filters, sort, pages); POST /api/v1/stamps — add a stamp (keepers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { createStamp, getStamp, listStamps } from "@/lib/data/stamps";
import { createStampSchema, stampListQuerySchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listStamps", permission: "data:read", query: stampListQuerySchema }, async ({ actor, query }) => listStamps(actor, query)),
  POST: apiRoute({ operation: "createStamp", permission: "stamps:write", body: createStampSchema, answers: { status: 201 } }, async ({ actor, body }) => {
    const { code } = await createStamp(actor, body);
    return created({ stamp: await getStamp(actor, code) });
  }),
});
