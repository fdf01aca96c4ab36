// GET/DELETE /api/v1/stamps/{code}/scans/{id} — one scan; deleting removes its files from the store (keepers)
import { apiRoute, noContent, parseOrThrow } from "@/lib/api/route";
import { deleteScan, getScan } from "@/lib/data/scans";
import { scanIdParamSchema } from "@/lib/validation/scans";

type Params = { code: string; id: string };

export const GET = apiRoute<Params>({ permission: "data:read" }, async ({ actor, params }) => {
  const { code, id } = parseOrThrow(scanIdParamSchema, params);
  return { scan: await getScan(actor, code, id) };
});

export const DELETE = apiRoute<Params>({ permission: "stamps:write" }, async ({ actor, params }) => {
  const { code, id } = parseOrThrow(scanIdParamSchema, params);
  await deleteScan(actor, code, id);
  return noContent();
});
