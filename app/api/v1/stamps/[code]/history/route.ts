// GET /api/v1/stamps/{code}/history — everything that happened to a stamp, newest first
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { stampHistory } from "@/lib/data/stamps";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const GET = apiRoute<{ code: string }>({ permission: "data:read" }, async ({ actor, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  return { events: await stampHistory(actor, code) };
});
