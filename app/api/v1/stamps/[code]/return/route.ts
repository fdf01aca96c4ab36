// POST /api/v1/stamps/{code}/return — take a checked-out stamp back (keepers)
import { apiRoute, parseOrThrow, readJson } from "@/lib/api/route";
import { returnStamp } from "@/lib/data/stamps";
import { returnSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ code: string }>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  const input = request.headers.get("content-length") === "0" ? {} : await readJson(request, returnSchema);
  return { return: await returnStamp(actor, code, input) };
});
