// GET /api/v1/stamps/{code}/history — everything that happened to a stamp, newest first
import { apiRoute, methods } from "@/lib/api/route";
import { stampHistory } from "@/lib/data/stamps";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getStampHistory", permission: "data:read", params: stampCodeParamSchema }, async ({ actor, params }) => ({
    events: await stampHistory(actor, params.code),
  })),
});
