// GET /api/v1/wax/calibration — the application rate fitted from recorded wax uses, per recipe and per recipe and cloth
import { apiRoute, methods } from "@/lib/api/route";
import { getCalibration } from "@/lib/data/wax";
import { withMessages } from "@/lib/error-body";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxCalibration", permission: "data:read" }, async ({ actor, t }) => withMessages(await getCalibration(actor), t)),
});
