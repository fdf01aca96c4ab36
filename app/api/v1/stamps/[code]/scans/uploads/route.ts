// POST /api/v1/stamps/{code}/scans/uploads — a presigned PUT for one scan file; the browser uploads straight to the store (keepers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { scanBodyRefusal } from "@/lib/api/scan-body";
import { presignScanUpload } from "@/lib/data/scans";
import { presignScanSchema } from "@/lib/validation/scans";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "presignScanUpload", permission: "stamps:write", params: stampCodeParamSchema, body: presignScanSchema, bodyRefusal: scanBodyRefusal, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created(await presignScanUpload(actor, params.code, body)),
  ),
});
