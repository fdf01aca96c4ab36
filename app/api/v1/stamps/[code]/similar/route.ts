// GET /api/v1/stamps/{code}/similar — stamps whose scans look like this stamp's (mirror twins included)
import { apiRoute, methods } from "@/lib/api/route";
import { similarStamps } from "@/lib/data/scans";
import { stampCodeParamSchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listSimilarStamps", permission: "data:read", params: stampCodeParamSchema }, async ({ actor, params }) => ({
    stamps: await similarStamps(actor, params.code),
  })),
});
