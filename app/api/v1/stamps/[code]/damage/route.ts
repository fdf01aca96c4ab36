// POST /api/v1/stamps/{code}/damage — report damage to a stamp (everyone); the keepers get an e-mail
import { apiRoute, created, parseOrThrow, readJson } from "@/lib/api/route";
import { reportDamage } from "@/lib/data/stamps";
import { damageReportSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ code: string }>({ permission: "stamps:request" }, async ({ actor, request, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  const input = await readJson(request, damageReportSchema);
  return created({ report: await reportDamage(actor, code, input) });
});
