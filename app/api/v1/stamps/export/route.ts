// GET /api/v1/stamps/export — the stamps matching the list filters as a CSV file (same query as GET /api/v1/stamps)
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { exportStampsCsv } from "@/lib/data/stamp-csv";
import { queryObject, stampListQuerySchema } from "@/lib/validation/stamps";

export const GET = apiRoute({ permission: "data:read" }, async ({ actor, request }) => {
  const query = parseOrThrow(stampListQuerySchema, queryObject(new URL(request.url).searchParams));
  const csv = await exportStampsCsv(actor, query);
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(`\uFEFF${csv}`, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="stamps-${stamp}.csv"`,
      "cache-control": "no-store",
    },
  });
});
