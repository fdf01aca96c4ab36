// POST /api/v1/stamps/{code}/damage — report damage to a stamp (everyone); the keepers get an e-mail
import { apiRoute, created, methods } from "@/lib/api/route";
import { reportDamage } from "@/lib/data/stamps";
import { damageReportSchema, stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "reportStampDamage", permission: "stamps:request", params: stampCodeParamSchema, body: damageReportSchema, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ report: await reportDamage(actor, params.code, body) }),
  ),
});
