// GET /api/v1/stamps/export — the stamps matching the list filters as a CSV file (same query as GET /api/v1/stamps)
import { apiRoute, methods } from "@/lib/api/route";
import { todayIso } from "@/lib/dates";
import { exportStampsCsv } from "@/lib/data/stamps/csv";
import { stampListQuerySchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "exportStamps", permission: "data:read", query: stampListQuerySchema, answers: { type: "text/csv" } }, async ({ actor, query }) => {
    const csv = await exportStampsCsv(actor, query);
    return new Response(`\uFEFF${csv}`, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="stamps-${todayIso()}.csv"`,
        "cache-control": "no-store",
      },
    });
  }),
});
