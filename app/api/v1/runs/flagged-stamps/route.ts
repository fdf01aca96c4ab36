// GET /api/v1/runs/flagged-stamps — stamps with three findings of one kind within 30 days, for the keepers (everyone reads)
import { apiRoute, methods } from "@/lib/api/route";
import { listFlaggedStamps } from "@/lib/data/runs";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listFlaggedStamps", permission: "data:read" }, async ({ actor }) => ({ stamps: await listFlaggedStamps(actor) })),
});
