// POST /api/v1/wax/estimate — the wax a run takes, for a saved plan or a waxed area per metre, without saving it (any signed-in user)
import { apiRoute, methods } from "@/lib/api/route";
import { computeEstimate } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";
import { estimateRequestSchema } from "@/lib/validation/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "computeWaxEstimate", permission: "data:read", body: estimateRequestSchema }, async ({ actor, body, t }) => withMessages(await computeEstimate(actor, body), t)),
});
