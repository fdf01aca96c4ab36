import { z } from "@/lib/zod";
import { locales } from "@/lib/i18n/config";
import { roles } from "@/lib/permissions";

const email = z.string().trim().toLowerCase().max(254, "validation.tooLong").pipe(z.email("validation.email"));
const name = z.string().trim().min(1, "validation.required").max(120, "validation.tooLong");
/** Long passphrases welcome; no composition rules (NIST SP 800-63B). */
export const password = z.string().min(10, "validation.passwordTooShort").max(256, "validation.tooLong");

export const roleSchema = z.enum(roles, "validation.invalidOption");
export const unitSystemSchema = z.enum(["metric", "imperial"], "validation.invalidOption");
export const localeSchema = z.enum(locales, "validation.invalidOption");

export const signInSchema = z.object({
  email,
  password: z.string().min(1, "validation.required").max(256, "validation.tooLong"),
});

/** Without a language the invitation goes out in the workshop's default and the browser decides at the first sign-in. */
export const inviteUserSchema = z.object({ email, name, role: roleSchema, locale: localeSchema.optional() });

export const updateUserSchema = z
  .object({ name, role: roleSchema, disabled: z.boolean() })
  .partial()
  .refine((v) => Object.keys(v).length > 0, "validation.nothingToChange");

export const forgotPasswordSchema = z.object({ email });

export const setPasswordSchema = z
  .object({
    token: z.string().min(20, "validation.tokenInvalid").max(200, "validation.tokenInvalid"),
    password,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { message: "validation.passwordsDiffer", path: ["confirm"] });

export const updateProfileSchema = z.object({ name, unitSystem: unitSystemSchema, locale: localeSchema });

/** The header's language switch. */
export const chooseLocaleSchema = z.object({ locale: localeSchema });

export const createApiTokenSchema = z.object({ name: z.string().trim().min(1, "validation.required").max(80, "validation.tooLong") });

export { idParamSchema } from "./common";

export type InviteUserInput = z.infer<typeof inviteUserSchema>;
export type UpdateUserInput = z.infer<typeof updateUserSchema>;
