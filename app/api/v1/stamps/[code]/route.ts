// GET/PATCH/DELETE /api/v1/stamps/{code} — one stamp; changes need the version they start from (409 on a conflict)
import { apiRoute, methods, noContent } from "@/lib/api/route";
import { deleteStamp, getStamp, updateStamp } from "@/lib/data/stamps";
import { deleteStampSchema, stampCodeParamSchema, updateStampSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getStamp", permission: "data:read", params: stampCodeParamSchema }, async ({ actor, params }) => ({ stamp: await getStamp(actor, params.code) })),
  PATCH: apiRoute({ operation: "updateStamp", permission: "stamps:write", params: stampCodeParamSchema, body: updateStampSchema }, async ({ actor, params, body }) => {
    const updated = await updateStamp(actor, params.code, body);
    return { stamp: await getStamp(actor, updated.code) };
  }),
  DELETE: apiRoute(
    { operation: "deleteStamp", permission: "stamps:write", params: stampCodeParamSchema, query: deleteStampSchema, answers: { status: 204 } },
    async ({ actor, params, query }) => {
      await deleteStamp(actor, params.code, query.version);
      return noContent();
    },
  ),
});
