// POST /api/v1/stamps/import — add or update stamps from a CSV body (?dryRun=true only checks it); all rows or none (keepers)
import { mediaTypeOf, readBodyText } from "@/lib/api/body";
import { apiRoute, methods } from "@/lib/api/route";
import { importLimits, importStampsCsv } from "@/lib/data/stamps/csv";
import { AppError } from "@/lib/errors";
import { importQuerySchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "importStamps", permission: "stamps:write", query: importQuerySchema, accepts: "text/csv" }, async ({ actor, request, query }) => {
    if (!["text/csv", "text/plain"].includes(mediaTypeOf(request.headers.get("content-type")))) throw new AppError("csvMediaType");
    const text = await readBodyText(request, importLimits.maxBytes);
    return { import: await importStampsCsv(actor, text, { dryRun: query.dryRun === true }) };
  }),
});
