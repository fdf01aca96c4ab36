// GET/PATCH /api/v1/wax/defaults — the defaults of new estimates: rate before calibration, losses, recovery (wax masters change them)
import { apiRoute, methods } from "@/lib/api/route";
import { getWaxDefaults, updateWaxDefaults } from "@/lib/data/wax";
import { updateWaxDefaultsSchema } from "@/lib/validation/settings";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getWaxDefaults", permission: "data:read" }, async ({ actor }) => ({ defaults: await getWaxDefaults(actor) })),
  PATCH: apiRoute({ operation: "updateWaxDefaults", permission: "wax:write", body: updateWaxDefaultsSchema }, async ({ actor, body }) => ({ defaults: await updateWaxDefaults(actor, body) })),
});
