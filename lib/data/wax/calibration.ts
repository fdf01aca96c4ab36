import "server-only";
import { asc, isNull } from "drizzle-orm";
import { db } from "@/db";
import { waxRecipes, waxUses, type WaxUseRow } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { CalibrationDto } from "@/lib/contracts/wax";
import { calibrateRates, calibratedRate, useAreaM2 as areaOfUse, type Calibration, type WaxUseRecord } from "@/lib/wax";
import { currentSettings } from "../settings";
import type { Db } from "./shared";

// The application rate fitted from recorded wax uses (least squares through the origin, per recipe and per
// recipe and cloth; lib/wax calibrateRates), offered as the default rate of new estimates.

/** Cloths are named freely; the fit groups them trimmed and case-insensitively. */
export const clothKey = (cloth: string | null | undefined) => (cloth ? cloth.trim().toLocaleLowerCase("en") : null);

const toRecord = (u: WaxUseRow): WaxUseRecord => ({
  id: u.id,
  recipeId: u.recipeId,
  clothId: clothKey(u.cloth),
  waxedAreaPerMetreM2: u.waxedAreaPerMetreM2,
  metres: u.metres,
  passes: u.passes,
  gramsUsed: u.grams,
});

async function activeUses(tx: Db): Promise<WaxUseRow[]> {
  return tx.select().from(waxUses).where(isNull(waxUses.withdrawnAt)).orderBy(asc(waxUses.usedOn), asc(waxUses.recordedAt));
}

/** The calibration of every recipe with recorded uses. */
export async function calibrationOf(tx: Db): Promise<{ calibration: Calibration; uses: WaxUseRow[] }> {
  const uses = await activeUses(tx);
  return { calibration: calibrateRates(uses.map(toRecord)), uses };
}

/** The rate to offer for a recipe (and cloth): the calibrated one when there are enough uses, else null. */
export async function calibratedRateFor(tx: Db, recipeId: string, cloth?: string | null) {
  const { calibration } = await calibrationOf(tx);
  return calibratedRate(calibration, recipeId, clothKey(cloth));
}

export async function getCalibration(actor: Actor): Promise<CalibrationDto> {
  assertCan(actor, "data:read");
  const [{ calibration, uses }, recipes, { settings }] = await Promise.all([calibrationOf(db), db.select({ id: waxRecipes.id, name: waxRecipes.name }).from(waxRecipes), currentSettings()]);
  const names = new Map(recipes.map((r) => [r.id, r.name]));
  // The name a cloth was first written with stands for its group.
  const clothNames = new Map<string, string>();
  for (const u of uses) {
    const key = clothKey(u.cloth);
    if (key && !clothNames.has(key)) clothNames.set(key, u.cloth!.trim());
  }
  const flaggedIds = new Set(calibration.flagged.map((f) => f.id));
  return {
    minUses: calibration.minUses,
    defaultRateGPerM2: settings.waxRateGPerM2,
    recipes: calibration.byRecipe.map((r) => ({
      recipeId: r.recipeId,
      recipeName: names.get(r.recipeId) ?? "",
      enoughUses: r.enoughUses,
      fit: r.fit,
      cloths: calibration.byRecipeCloth.filter((c) => c.recipeId === r.recipeId).map((c) => ({ cloth: clothNames.get(c.clothId) ?? c.clothId, fit: c.fit })),
      points: uses
        .filter((u) => u.recipeId === r.recipeId && !flaggedIds.has(u.id))
        .map((u) => ({ useId: u.id, usedOn: u.usedOn, cloth: u.cloth, areaM2: areaOfUse(toRecord(u)), grams: u.grams })),
    })),
    flagged: calibration.flagged.map((f) => ({ useId: f.id ?? null, code: f.code, params: f.params })),
  };
}
