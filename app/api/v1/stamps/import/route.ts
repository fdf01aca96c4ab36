// POST /api/v1/stamps/import — add or update stamps from a CSV body (?dryRun=true only checks it); all rows or none (keepers)
import { apiRoute, methods } from "@/lib/api/route";
import { importLimits, importStampsCsv } from "@/lib/data/stamp-csv";
import { AppError } from "@/lib/errors";
import { importQuerySchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "importStamps", permission: "stamps:write", query: importQuerySchema, accepts: "text/csv" }, async ({ actor, request, query }) => {
    const type = (request.headers.get("content-type") ?? "").toLowerCase();
    if (!type.startsWith("text/csv") && !type.startsWith("text/plain")) throw new AppError("csvMediaType");
    if (Number(request.headers.get("content-length") ?? 0) > importLimits.maxBytes) throw new AppError("payloadTooLarge");
    const text = await request.text();
    if (Buffer.byteLength(text) > importLimits.maxBytes) throw new AppError("payloadTooLarge");
    return { import: await importStampsCsv(actor, text, { dryRun: query.dryRun === true }) };
  }),
});
