// GET /api/v1/stamps — list stamps (search, filters, sort, pages); POST /api/v1/stamps — add a stamp (keepers)
import { apiRoute, created, parseOrThrow, readJson } from "@/lib/api/route";
import { createStamp, getStamp, listStamps } from "@/lib/data/stamps";
import { createStampSchema, queryObject, stampListQuerySchema } from "@/lib/validation/stamps";

export const GET = apiRoute({ permission: "data:read" }, async ({ actor, request }) => {
  const query = parseOrThrow(stampListQuerySchema, queryObject(new URL(request.url).searchParams));
  return listStamps(actor, query);
});

export const POST = apiRoute({ permission: "stamps:write" }, async ({ actor, request }) => {
  const input = await readJson(request, createStampSchema);
  const { code } = await createStamp(actor, input);
  return created({ stamp: await getStamp(actor, code) });
});
