// GET /api/v1/plans/stamps/{code} — one library stamp as the planner computes and draws it (geometry, picture)
import { apiRoute, methods } from "@/lib/api/route";
import { getPlannerStamp } from "@/lib/data/plans";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getPlannerStamp", permission: "data:read", params: stampCodeParamSchema }, async ({ actor, params }) => ({ stamp: await getPlannerStamp(actor, params.code) })),
});
