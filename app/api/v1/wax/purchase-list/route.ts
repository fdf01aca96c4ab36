// GET /api/v1/wax/purchase-list — what to buy for the planned estimates, by material, against stock and reorder levels
import { apiRoute, methods } from "@/lib/api/route";
import { getPurchaseList } from "@/lib/data/wax";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxPurchaseList", permission: "data:read" }, async ({ actor }) => getPurchaseList(actor)),
});
