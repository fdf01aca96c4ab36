import "server-only";

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
