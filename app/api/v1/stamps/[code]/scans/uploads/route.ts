// POST /api/v1/stamps/{code}/scans/uploads — a presigned PUT for one scan file; the browser uploads straight to the store (keepers)
import { apiRoute, created, parseOrThrow } from "@/lib/api/route";
import { readScanJson, withScanErrors } from "@/lib/api/scan-route";
import { presignScanUpload } from "@/lib/data/scans";
import { presignScanSchema } from "@/lib/validation/scans";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const POST = apiRoute<{ code: string }>({ permission: "stamps:write" }, async ({ actor, request, params, t }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  return withScanErrors(t, async () => created(await presignScanUpload(actor, code, await readScanJson(request, presignScanSchema))));
});
