// GET /api/v1/checkouts — stamps that are out (?overdue=true: only those past their due date)
import { z } from "zod";
import { apiRoute, parseOrThrow } from "@/lib/api/route";
import { listCheckouts } from "@/lib/data/stamps";

const querySchema = z.object({ overdue: z.enum(["true", "false"], "validation.invalidOption").optional() });

export const GET = apiRoute({ permission: "data:read" }, async ({ actor, request }) => {
  const { overdue } = parseOrThrow(querySchema, Object.fromEntries(new URL(request.url).searchParams));
  return { checkouts: await listCheckouts(actor, { overdue: overdue === "true" }) };
});
