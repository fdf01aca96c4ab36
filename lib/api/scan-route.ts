import "server-only";
import { NextResponse } from "next/server";
import { ScanProblem } from "@/lib/data/scans";
import type { Translator } from "@/lib/i18n/translator";
import { ScanRejected, scanRejectedStatus } from "@/lib/scans";
import { MAX_FILE_NAME_LENGTH } from "@/lib/scans/file-name";
import { controlCharacterMessage } from "@/lib/validation/parse";
import type { z } from "zod";
import { readJson, ValidationFailed } from "./route";

const MIB = 1024 * 1024;

/** Catalogue values for a refusal: byte counts as MB, so messages read "larger than 8 MB". */
function messageValues(params: Record<string, string | number>) {
  const values: Record<string, string | number> = { ...params };
  for (const key of ["maxBytes", "sizeBytes"]) {
    if (typeof params[key] === "number") values[key.replace("Bytes", "Mb")] = Math.round(((params[key] as number) / MIB) * 10) / 10;
  }
  return values;
}

/**
 * The JSON answer for a refused scan (`scans.rejected.<code>`, status from lib/scans) or a scan request that
 * cannot go ahead (`scans.problems.<code>`); null for any other error, which apiRoute answers as usual.
 */
export function scanErrorResponse(error: unknown, t: Translator): Response | null {
  if (error instanceof ScanRejected) {
    const values = messageValues(error.params);
    return NextResponse.json({ error: { code: error.code, message: t(`scans.rejected.${error.code}`, values) } }, { status: scanRejectedStatus[error.code] });
  }
  if (error instanceof ScanProblem) {
    return NextResponse.json(
      { error: { code: error.code === "duplicate" ? "scanDuplicate" : "scanUploadMissing", message: t(`scans.problems.${error.code}`, error.params), ...(error.existing ? { existing: error.existing } : {}) } },
      { status: error.status },
    );
  }
  return null;
}

/** Runs a scan route's work and answers scan refusals itself; other errors go on to apiRoute. */
export async function withScanErrors<T>(t: Translator, work: () => Promise<T>): Promise<T | Response> {
  try {
    return await work();
  } catch (error) {
    const response = scanErrorResponse(error, t);
    if (response) return response;
    throw error;
  }
}

/**
 * Reads a scan route's JSON body (readJson). A file name the shared control-character rule refuses is
 * reported the way lib/scans refuses every hidden character in a name (bidirectional overrides too):
 * as badFileName, the refusal the uploader already explains. Call inside withScanErrors.
 */
export async function readScanJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  try {
    return await readJson(request, schema);
  } catch (error) {
    const hidden = error instanceof ValidationFailed && error.issues.some((i) => i.path.join(".") === "fileName" && i.message === controlCharacterMessage);
    if (hidden) throw new ScanRejected("badFileName", { reason: "hiddenCharacters", maxLength: MAX_FILE_NAME_LENGTH });
    throw error;
  }
}

/** A streamed object as an HTTP answer; keys are random and never reused, so the browser may keep it. */
export function objectResponse(
  object: { body: ReadableStream<Uint8Array>; sizeBytes: number | null; contentType: string },
  headers: Record<string, string> = {},
): Response {
  return new Response(object.body, {
    headers: {
      "content-type": object.contentType,
      ...(object.sizeBytes !== null ? { "content-length": String(object.sizeBytes) } : {}),
      "cache-control": "private, max-age=86400, immutable",
      "x-content-type-options": "nosniff",
      ...headers,
    },
  });
}
