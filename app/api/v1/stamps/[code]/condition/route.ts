// POST /api/v1/stamps/{code}/condition — move a stamp along its repair path or retire it (keepers)
import { apiRoute, parseOrThrow, readJson } from "@/lib/api/route";
import { changeCondition } from "@/lib/data/stamps";
import { conditionChangeSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ code: string }>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  const input = await readJson(request, conditionChangeSchema);
  return { stamp: await changeCondition(actor, code, input) };
});
