// POST /api/v1/stamps/{code}/checkout — hand a stamp out to a person and workstation until a due date (keepers)
import { apiRoute, created, parseOrThrow, readJson } from "@/lib/api/route";
import { checkOutStamp } from "@/lib/data/stamps";
import { checkoutSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ code: string }>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  const input = await readJson(request, checkoutSchema);
  return created({ checkout: await checkOutStamp(actor, code, input) });
});
