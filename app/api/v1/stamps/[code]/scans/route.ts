// GET/POST /api/v1/stamps/{code}/scans — list a stamp's scans; keep an uploaded file as a scan (keepers)
import { apiRoute, created, parseOrThrow } from "@/lib/api/route";
import { readScanJson, withScanErrors } from "@/lib/api/scan-route";
import { completeScanUpload, listScans, scanLimits } from "@/lib/data/scans";
import { completeScanSchema } from "@/lib/validation/scans";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

type Params = { code: string };

export const GET = apiRoute<Params>({ permission: "data:read" }, async ({ actor, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  const { maxBytes, maxPixels } = scanLimits();
  return { scans: await listScans(actor, code), limits: { maxBytes, maxPixels } };
});

export const POST = apiRoute<Params>({ permission: "stamps:write" }, async ({ actor, request, params, t }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  return withScanErrors(t, async () => created({ scan: await completeScanUpload(actor, code, await readScanJson(request, completeScanSchema)) }));
});
