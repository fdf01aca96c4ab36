import "server-only";
import { desc, eq, sql } from "drizzle-orm";
import { cache } from "react";
import { db } from "@/db";
import { workshopSettingChanges, workshopSettings as settingsTable } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { isoDateIn } from "@/lib/time-zone";
import { workshopSettingKeys, workshopSettingsSchema, type UpdateWorkshopSettingsInput, type WorkshopSettings } from "@/lib/validation/settings";

const SETTINGS_ID = 1;

export interface SettingChangeDto {
  id: string;
  version: number;
  at: string;
  actorName: string;
  changes: { key: string; from: unknown; to: unknown }[];
}

export interface SettingsPageDto {
  settings: WorkshopSettings;
  version: number;
  updatedAt: string | null;
  history: SettingChangeDto[];
}

async function readRow() {
  const [row] = await db.select().from(settingsTable).where(eq(settingsTable.id, SETTINGS_ID)).limit(1);
  return row ?? null;
}

/**
 * The workshop's settings, typed, with defaults for anything never set. Everyone's pages and mails read
 * them (the time zone), so no permission is asked here; cached per request.
 */
export const workshopSettings = cache(async (): Promise<WorkshopSettings> => workshopSettingsSchema.parse((await readRow())?.values ?? {}));

/** The settings and their version read now, past the per-request cache (after a save in the same request). */
export async function currentSettings(): Promise<{ settings: WorkshopSettings; version: number }> {
  const row = await readRow();
  return { settings: workshopSettingsSchema.parse(row?.values ?? {}), version: row?.version ?? 1 };
}

/** The zone every date on screen and in mail is shown in. */
export const workshopTimeZone = async () => (await workshopSettings()).timeZone;

/** Today's date at the workshop (YYYY-MM-DD): check-outs are due at the end of their due date there. */
export const workshopToday = async () => isoDateIn(await workshopTimeZone());

/** The settings page: current values, their version and who changed what (newest first). */
export async function getSettingsPage(actor: Actor): Promise<SettingsPageDto> {
  assertCan(actor, "settings:manage");
  const [row, history] = await Promise.all([
    readRow(),
    db.select().from(workshopSettingChanges).orderBy(desc(workshopSettingChanges.version)).limit(100),
  ]);
  return {
    settings: workshopSettingsSchema.parse(row?.values ?? {}),
    version: row?.version ?? 1,
    updatedAt: row?.updatedAt.toISOString() ?? null,
    history: history.map((h) => ({ id: h.id, version: h.version, at: h.at.toISOString(), actorName: h.actorName, changes: h.changes })),
  };
}

/**
 * Saves the settings named in `input`, made from `input.version`. Someone else's save in between → 409
 * settingsConflict. One history entry per save lists each setting that changed; a save that changes
 * nothing keeps the version.
 */
export async function updateWorkshopSettings(actor: Actor, input: UpdateWorkshopSettingsInput): Promise<SettingsPageDto> {
  assertCan(actor, "settings:manage");
  const { version, ...patch } = input;
  await saveSettings(actor, version, patch);
  return getSettingsPage(actor);
}

/**
 * The one write of the settings row, for the admin form and the wax room's defaults alike (each checks its own
 * permission first): locks the row, refuses a stale version (409 settingsConflict), stores the merged values
 * and one history entry listing what changed. Answers the settings' version after the save.
 */
export async function saveSettings(actor: Actor, version: number, patch: Partial<WorkshopSettings>): Promise<number> {
  return db.transaction(async (tx) => {
    await tx.insert(settingsTable).values({ id: SETTINGS_ID }).onConflictDoNothing();
    const [row] = await tx.select().from(settingsTable).where(eq(settingsTable.id, SETTINGS_ID)).for("update");
    if (row.version !== version) throw new AppError("settingsConflict");
    const before = workshopSettingsSchema.parse(row.values);
    const after = workshopSettingsSchema.parse({ ...before, ...patch });
    const changes = workshopSettingKeys.filter((key) => JSON.stringify(before[key]) !== JSON.stringify(after[key])).map((key) => ({ key: key as string, from: before[key], to: after[key] }));
    if (changes.length === 0) return row.version;
    const [updated] = await tx
      .update(settingsTable)
      .set({ values: after, version: sql`${settingsTable.version} + 1`, updatedBy: actor.id, updatedAt: sql`now()` })
      .where(eq(settingsTable.id, SETTINGS_ID))
      .returning({ version: settingsTable.version });
    await tx.insert(workshopSettingChanges).values({ version: updated.version, actorId: actor.id, actorName: actor.name, changes });
    return updated.version;
  });
}

/** The settings' current version (what a form that writes part of them starts from). */
export async function settingsVersion(): Promise<number> {
  return (await readRow())?.version ?? 1;
}
