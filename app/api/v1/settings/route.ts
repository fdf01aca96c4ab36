// GET /api/v1/settings — the workshop settings, their version and history; PATCH — change them (admins)
import { apiRoute, methods } from "@/lib/api/route";
import { getSettingsPage, updateWorkshopSettings } from "@/lib/data/settings";
import { updateWorkshopSettingsSchema } from "@/lib/validation/settings";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  GET: apiRoute({ operation: "getSettings", permission: "settings:manage" }, async ({ actor }) => getSettingsPage(actor)),
  PATCH: apiRoute({ operation: "updateSettings", permission: "settings:manage", body: updateWorkshopSettingsSchema }, async ({ actor, body }) =>
    updateWorkshopSettings(actor, body),
  ),
});
