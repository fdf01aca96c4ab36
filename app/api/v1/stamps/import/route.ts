// POST /api/v1/stamps/import — add or update stamps from a CSV body (?dryRun=true only checks it); all rows or none (keepers)
import { NextResponse } from "next/server";
import { z } from "zod";
import { mediaTypeOf, readBodyText } from "@/lib/api/body";
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { importLimits, importStampsCsv } from "@/lib/data/stamp-csv";
import { AppError } from "@/lib/errors";

const querySchema = z.object({ dryRun: z.enum(["true", "false"], "validation.invalidOption").optional() });

export const POST = apiRoute({ permission: "stamps:write" }, async ({ actor, request, t }) => {
  const { dryRun } = parseOrThrow(querySchema, Object.fromEntries(new URL(request.url).searchParams));
  if (!["text/csv", "text/plain"].includes(mediaTypeOf(request.headers.get("content-type")))) throw new AppError("csvMediaType");
  const text = await readBodyText(request, importLimits.maxBytes);
  const result = await importStampsCsv(actor, text, { dryRun: dryRun === "true", t });
  if (!result.ok) {
    return NextResponse.json(
      { error: { code: "importInvalid", message: t("errors.importInvalid", { count: new Set(result.problems.map((p) => p.line)).size }), rows: result.problems } },
      { status: 422 },
    );
  }
  return { import: result };
});
