// GET/POST /api/v1/stamps/{code}/scans/{id}/coverage — measure coverage for a polarity and threshold; save it to the stamp (keepers)
import { apiRoute, parseOrThrow, readJson } from "@/lib/api/route";
import { previewCoverage, saveCoverage } from "@/lib/data/scans";
import { coveragePreviewSchema, saveCoverageSchema, scanIdParamSchema } from "@/lib/validation/scans";

type Params = { code: string; id: string };

export const GET = apiRoute<Params>({ permission: "data:read" }, async ({ actor, request, params }) => {
  const { code, id } = parseOrThrow(scanIdParamSchema, params);
  const query = parseOrThrow(coveragePreviewSchema, Object.fromEntries(new URL(request.url).searchParams));
  return { coverage: await previewCoverage(actor, code, id, query) };
});

export const POST = apiRoute<Params>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { code, id } = parseOrThrow(scanIdParamSchema, params);
  const input = await readJson(request, saveCoverageSchema);
  return saveCoverage(actor, code, id, input);
});
