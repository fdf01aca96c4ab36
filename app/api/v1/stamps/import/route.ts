// POST /api/v1/stamps/import — add or update stamps from a CSV body (?dryRun=true only checks it); all rows or none (keepers)
import { NextResponse } from "next/server";
import { z } from "zod";
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { importLimits, importStampsCsv } from "@/lib/data/stamp-csv";
import { AppError } from "@/lib/errors";

const querySchema = z.object({ dryRun: z.enum(["true", "false"], "validation.invalidOption").optional() });

export const POST = apiRoute({ permission: "stamps:write" }, async ({ actor, request, t }) => {
  const { dryRun } = parseOrThrow(querySchema, Object.fromEntries(new URL(request.url).searchParams));
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  if (!type.startsWith("text/csv") && !type.startsWith("text/plain")) throw new AppError("csvMediaType");
  if (Number(request.headers.get("content-length") ?? 0) > importLimits.maxBytes) throw new AppError("payloadTooLarge");
  const text = await request.text();
  if (Buffer.byteLength(text) > importLimits.maxBytes) throw new AppError("payloadTooLarge");
  const result = await importStampsCsv(actor, text, { dryRun: dryRun === "true", t });
  if (!result.ok) {
    return NextResponse.json(
      { error: { code: "importInvalid", message: t("errors.importInvalid", { count: new Set(result.problems.map((p) => p.line)).size }), rows: result.problems } },
      { status: 422 },
    );
  }
  return { import: result };
});
