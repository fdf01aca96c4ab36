import { AppError } from "@/lib/errors";

/** Largest JSON body any /api/v1 route reads (the largest real one, a layout with a 200 KB outline, fits with room). */
export const JSON_BODY_MAX_BYTES = 1024 * 1024;

/** The media type of a Content-Type header without its parameters, lower case: "Application/JSON; charset=utf-8" → "application/json". */
export function mediaTypeOf(contentType: string | null): string {
  return (contentType ?? "").split(";")[0].trim().toLowerCase();
}

/** application/json itself, or a JSON-based type with the +json suffix (RFC 6839), e.g. application/merge-patch+json. */
export function isJsonMediaType(mediaType: string): boolean {
  return mediaType === "application/json" || /^application\/[a-z0-9][a-z0-9!#$&^_.+-]*\+json$/.test(mediaType);
}

/**
 * Reads a request body as UTF-8 text, at most `maxBytes`: 413 as soon as more arrives. The bytes are
 * counted while reading, so a chunked body without Content-Length, or one longer than it claims, gets
 * no further than one that declares its size honestly (which is refused before reading at all).
 */
export async function readBodyText(request: Request, maxBytes: number): Promise<string> {
  return (await readBodyBytes(request, maxBytes)).toString("utf8");
}

/** Reads a request body as bytes, at most `maxBytes`, counted while reading (as readBodyText). */
export async function readBodyBytes(request: Request, maxBytes: number): Promise<Buffer> {
  const tooLarge = () => new AppError("payloadTooLarge", { maxBytes });
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) throw tooLarge();
  if (!request.body) return Buffer.alloc(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}
