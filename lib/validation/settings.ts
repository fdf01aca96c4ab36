import { z } from "@/lib/zod";
import { isTimeZone } from "@/lib/time-zone";

// The workshop's settings: one schema, one place. To add a setting, add a field here with its default
// (and `.catch` of the same default, so a value stored by an older release never breaks a page), a line
// in the settings form, and its texts under settings.fields.<name> in the catalogue. Readers get it from
// workshopSettings() in lib/data/settings.ts, typed.

export const defaultTimeZone = "Asia/Jakarta";

const timeZone = z.string("validation.timeZone").trim().refine(isTimeZone, "validation.timeZone");

const shape = {
  /** Every date and time on screen and in e-mails is shown in this zone. */
  timeZone,
};

/** Stored settings → typed settings with defaults for anything missing or no longer valid. */
export const workshopSettingsSchema = z.object({
  timeZone: shape.timeZone.default(defaultTimeZone).catch(defaultTimeZone),
});

export type WorkshopSettings = z.output<typeof workshopSettingsSchema>;
export type WorkshopSettingKey = keyof WorkshopSettings;
export const workshopSettingKeys = Object.keys(workshopSettingsSchema.shape) as WorkshopSettingKey[];

/** A change: any subset of the settings, and the version the editor started from (stale → 409). */
export const updateWorkshopSettingsSchema = z
  .object(shape)
  .partial()
  .extend({ version: z.coerce.number("validation.required").int().positive() })
  .strict();

export type UpdateWorkshopSettingsInput = z.output<typeof updateWorkshopSettingsSchema>;
