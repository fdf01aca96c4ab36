// GET/POST /api/v1/stamps/{code}/scans — list a stamp's scans; keep an uploaded file as a scan (keepers)
import { apiRoute, created, methods } from "@/lib/api/route";
import { scanBodyRefusal } from "@/lib/api/scan-body";
import { completeScanUpload, listScans, scanLimits } from "@/lib/data/scans";
import { completeScanSchema } from "@/lib/validation/scans";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listScans", permission: "data:read", params: stampCodeParamSchema }, async ({ actor, params }) => {
    const { maxBytes, maxPixels } = scanLimits();
    return { scans: await listScans(actor, params.code), limits: { maxBytes, maxPixels } };
  }),
  POST: apiRoute({ operation: "completeScanUpload", permission: "stamps:write", params: stampCodeParamSchema, body: completeScanSchema, bodyRefusal: scanBodyRefusal, answers: { status: 201 } }, async ({ actor, params, body }) =>
    created({ scan: await completeScanUpload(actor, params.code, body) }),
  ),
});
