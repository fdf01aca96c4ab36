// People and API tokens: the shapes the admin and account routes answer with, and their URLs.
// Neither server-only nor React.
import type { User } from "@/db/schema";

export interface UserDto {
  id: string;
  email: string;
  name: string;
  role: User["role"];
  disabled: boolean;
  invited: boolean;
  unitSystem: User["unitSystem"];
  locale: User["locale"];
  createdAt: string;
}

export interface ApiTokenDto {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
}

/** An API token as administrators see it: with its owner. */
export interface OwnedApiTokenDto extends ApiTokenDto {
  owner: { id: string; name: string; email: string; disabled: boolean };
}

export const peopleUrls = {
  users: () => "/api/v1/users",
  user: (id: string) => `/api/v1/users/${encodeURIComponent(id)}`,
  invitation: (id: string) => `/api/v1/users/${encodeURIComponent(id)}/invitation`,
  resetLink: (id: string) => `/api/v1/users/${encodeURIComponent(id)}/reset-link`,
  tokens: () => "/api/v1/tokens",
  token: (id: string) => `/api/v1/tokens/${encodeURIComponent(id)}`,
  allTokens: () => "/api/v1/admin/tokens",
  anyToken: (id: string) => `/api/v1/admin/tokens/${encodeURIComponent(id)}`,
  me: () => "/api/v1/me",
};

/**
 * The workshop settings form → updateWorkshopSettingsSchema input: the time zone, the cloth presets (rows of
 * name, width and margin in mm; an all-blank row is dropped) and the stamping rate.
 */
export function settingsFormInput(form: FormData) {
  const names = form.getAll("presetName").map(String);
  const widths = form.getAll("presetWidthMm").map(String);
  const margins = form.getAll("presetMarginMm").map(String);
  const number = (text: string | undefined) => (text === undefined || text.trim() === "" ? undefined : Number(text.trim().replace(",", ".")));
  const clothPresets = names
    .map((name, k) => ({ name, widthMm: number(widths[k]), marginMm: number(margins[k]) ?? 0 }))
    .filter((p, k) => p.name.trim() !== "" || (widths[k] ?? "").trim() !== "" || (margins[k] ?? "").trim() !== "");
  const rate = String(form.get("impressionsPerHour") ?? "");
  return {
    version: form.get("version"),
    timeZone: form.get("timeZone") ?? undefined,
    ...(names.length ? { clothPresets } : {}),
    ...(rate.trim() !== "" || form.has("impressionsPerHour") ? { impressionsPerHour: number(rate) } : {}),
  };
}
