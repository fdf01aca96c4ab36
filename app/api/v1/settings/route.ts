// GET /api/v1/settings — the workshop settings, their version and history; PATCH — change them (admins)
import { apiRoute, readJson } from "@/lib/api/route";
import { getSettingsPage, updateWorkshopSettings } from "@/lib/data/settings";
import { updateWorkshopSettingsSchema } from "@/lib/validation/settings";

export const GET = apiRoute({ permission: "settings:manage" }, async ({ actor }) => getSettingsPage(actor));

export const PATCH = apiRoute({ permission: "settings:manage" }, async ({ actor, request }) => updateWorkshopSettings(actor, await readJson(request, updateWorkshopSettingsSchema)));
