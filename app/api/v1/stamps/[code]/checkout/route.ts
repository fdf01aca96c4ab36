// POST /api/v1/stamps/{code}/checkout — hand a stamp out to a person and workstation until a due date (keepers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { checkOutStamp } from "@/lib/data/stamps";
import { checkoutSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "checkOutStamp", permission: "stamps:write", params: stampCodeParamSchema, body: checkoutSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ checkout: await checkOutStamp(actor, params.code, body) }),
  ),
});
