import { z } from "@/lib/zod";
import { DEFAULT_IMPRESSIONS_PER_HOUR_PER_FACE } from "@/lib/plans/run";
import { isTimeZone } from "@/lib/time-zone";
import { DEFAULT_RATE_G_PER_M2, LOSS_MAX_PCT, RATE_MAX_G_PER_M2, RECOVERY_MAX_PCT } from "@/lib/wax/limits";

// The workshop's settings: one schema, one place. To add a setting, add a field here with its default
// (and `.catch` of the same default, so a value stored by an older release never breaks a page), a line
// in the settings form, and its texts under settings.fields.<name> in the catalogue. Readers get it from
// workshopSettings() in lib/data/settings.ts, typed.

export const defaultTimeZone = "Asia/Jakarta";

/** Prices (wax materials per kg, estimate and purchase costs) are kept and shown in this currency. */
export const currencies = ["IDR", "USD"] as const;
export type Currency = (typeof currencies)[number];
export const defaultCurrency: Currency = "IDR";

/**
 * The wax master's defaults for new estimates (the wax room sets them, permission wax:write): the application
 * rate where no calibration exists yet (DEFAULT_RATE_G_PER_M2, derived in lib/wax/limits.ts), losses % and the
 * share recovered after the boil-off % (no published figure: 0 until someone sets it).
 */
export const waxDefaultValues = { waxRateGPerM2: DEFAULT_RATE_G_PER_M2, waxLossPct: 0, waxRecoveryPct: 0 } as const;

const timeZone = z.string("validation.timeZone").trim().refine(isTimeZone, "validation.timeZone");

/** A cloth the workshop buys: its name, its width selvedge to selvedge (ASTM D3774) and the margin it leaves each side, mm. */
const clothPreset = z
  .object({
    name: z.string("validation.required").trim().min(1, "validation.required").max(60, "validation.tooLong"),
    widthMm: z.number("validation.number").min(100, "validation.tooSmall").max(5000, "validation.tooBig"),
    marginMm: z.number("validation.number").min(0, "validation.tooSmall").max(500, "validation.tooBig").default(0),
  })
  .strict()
  .refine((p) => 2 * p.marginMm < p.widthMm, { message: "validation.presetMarginsTooWide", path: ["marginMm"] });

/**
 * The default presets: mori (batik cotton) about 106 cm (42 in) and 115 cm wide, and cotton sold 44 in wide with
 * about 42 in usable once the selvedges are trimmed (SPEC section 1; common practice): 1 in margins.
 */
export const defaultClothPresets = [
  { name: "Mori 106 cm", widthMm: 1060, marginMm: 0 },
  { name: "Mori 115 cm", widthMm: 1150, marginMm: 0 },
  { name: "Cotton 44 in", widthMm: 1117.6, marginMm: 25.4 },
];

const clothPresets = z
  .array(clothPreset)
  .max(12, "validation.tooMany")
  .superRefine((list, ctx) => {
    const seen = new Set<string>();
    list.forEach((p, k) => {
      const key = p.name.trim().toLowerCase();
      if (seen.has(key)) ctx.addIssue({ code: "custom", path: [k, "name"], message: "validation.presetNameTwice" });
      seen.add(key);
    });
  });

/** Impressions a stamper makes in an hour on one face (common practice, not a published figure; see lib/plans/run.ts). */
const impressionsPerHour = z.number("validation.number").min(1, "validation.tooSmall").max(1000, "validation.tooBig");

const shape = {
  /** Every date and time on screen and in e-mails is shown in this zone. */
  timeZone,
  currency: z.enum(currencies, "validation.invalidOption"),
  /** The cloths the planner offers as presets. */
  clothPresets,
  /** The stamping rate the planner turns impressions into hours with. */
  impressionsPerHour,
};

/** The wax room's defaults (see waxDefaultValues); written through lib/data/wax/defaults.ts, not the admin form. */
export const waxDefaultsShape = {
  waxRateGPerM2: z.number("validation.number").gt(0, "wax.mustBePositive").max(RATE_MAX_G_PER_M2, "validation.tooBig"),
  waxLossPct: z.number("validation.number").min(0, "validation.tooSmall").max(LOSS_MAX_PCT, "validation.tooBig"),
  waxRecoveryPct: z.number("validation.number").min(0, "validation.tooSmall").max(RECOVERY_MAX_PCT, "validation.tooBig"),
};

/** Stored settings → typed settings with defaults for anything missing or no longer valid. */
export const workshopSettingsSchema = z.object({
  timeZone: shape.timeZone.default(defaultTimeZone).catch(defaultTimeZone),
  currency: shape.currency.default(defaultCurrency).catch(defaultCurrency),
  waxRateGPerM2: waxDefaultsShape.waxRateGPerM2.default(waxDefaultValues.waxRateGPerM2).catch(waxDefaultValues.waxRateGPerM2),
  waxLossPct: waxDefaultsShape.waxLossPct.default(waxDefaultValues.waxLossPct).catch(waxDefaultValues.waxLossPct),
  waxRecoveryPct: waxDefaultsShape.waxRecoveryPct.default(waxDefaultValues.waxRecoveryPct).catch(waxDefaultValues.waxRecoveryPct),
  clothPresets: shape.clothPresets.default(defaultClothPresets).catch(defaultClothPresets),
  impressionsPerHour: shape.impressionsPerHour.default(DEFAULT_IMPRESSIONS_PER_HOUR_PER_FACE).catch(DEFAULT_IMPRESSIONS_PER_HOUR_PER_FACE),
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

/** The wax defaults' change, from the wax room: any subset, and the settings' version it started from. */
export const updateWaxDefaultsSchema = z
  .object(waxDefaultsShape)
  .partial()
  .extend({ version: z.coerce.number("validation.required").int().positive() })
  .strict();

export type UpdateWaxDefaultsInput = z.output<typeof updateWaxDefaultsSchema>;
