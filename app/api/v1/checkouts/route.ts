// GET /api/v1/checkouts — stamps that are out (?overdue=true: only those past their due date)
import { apiRoute, methods } from "@/lib/api/route";
import { listCheckouts } from "@/lib/data/stamps";
import { checkoutListQuerySchema } from "@/lib/validation/stamps";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "listCheckouts", permission: "data:read", query: checkoutListQuerySchema }, async ({ actor, query }) => ({
    checkouts: await listCheckouts(actor, { overdue: query.overdue === true }),
  })),
});
