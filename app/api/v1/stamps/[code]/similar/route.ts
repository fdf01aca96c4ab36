// GET /api/v1/stamps/{code}/similar — stamps whose scans look like this stamp's (mirror twins included)
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { similarStamps } from "@/lib/data/scans";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const GET = apiRoute<{ code: string }>({ permission: "data:read" }, async ({ actor, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  return { stamps: await similarStamps(actor, code) };
});
