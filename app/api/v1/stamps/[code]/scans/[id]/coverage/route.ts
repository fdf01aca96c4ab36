// GET/POST /api/v1/stamps/{code}/scans/{id}/coverage — measure coverage for a polarity and threshold; save it to the stamp (keepers)
import { apiRoute, methods } from "@/lib/api/route";
import { previewCoverage, saveCoverage } from "@/lib/data/scans";
import { coveragePreviewSchema, saveCoverageSchema, scanIdParamSchema } from "@/lib/validation/scans";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "measureScanCoverage", permission: "data:read", params: scanIdParamSchema, query: coveragePreviewSchema }, async ({ actor, params, query }) => ({
    coverage: await previewCoverage(actor, params.code, params.id, query),
  })),
  POST: apiRoute({ operation: "saveScanCoverage", permission: "stamps:write", params: scanIdParamSchema, body: saveCoverageSchema }, async ({ actor, params, body }) =>
    saveCoverage(actor, params.code, params.id, body),
  ),
});
