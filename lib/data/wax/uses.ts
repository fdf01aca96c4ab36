import "server-only";
import { and, desc, eq, inArray, isNull, isNotNull } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { stamps, waxRecipes, waxStockMovements, waxUseImpressions, waxUses, type WaxUseRow } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { WaxUseDto } from "@/lib/contracts/wax";
import { AppError } from "@/lib/errors";
import type { RecordWaxUseInput, WaxUseListQuery, WithdrawWaxUseInput } from "@/lib/validation/wax";
import { impressionsOfWaxing, massFractions, useAreaM2 as areaOfUse, useGrams as gramsOfUse } from "@/lib/wax";
import { addImpressions, type ImpressionsToAdd } from "../stamps/impressions";
import { planForWax } from "./plans";
import { loadRecipes } from "./shared";
import { audit } from "@/lib/log";
import { workshopToday } from "../settings";

// Wax uses: what one waxing actually used. Recording one takes its wax out of stock (a "use" movement per material
// of the recipe, by mass share) and adds its impressions to the stamps through the one writer of impression
// counts; the calibration fits the application rate from them. The same record serves a production run's waxing
// stage (run_stage_id, written through writeWaxUse). A use is never edited: a mistaken one is withdrawn, which moves its wax back into
// stock and takes its impressions back, and leaves it out of the calibration.

function toUseDto(u: WaxUseRow, recipeName: string, impressions: { stampCode: string; impressions: number }[]): WaxUseDto {
  const areaM2 = areaOfUse(u);
  return {
    id: u.id,
    usedOn: u.usedOn,
    planId: u.planId,
    runStageId: u.runStageId,
    recipe: { id: u.recipeId, name: recipeName },
    cloth: u.cloth,
    waxedAreaPerMetreM2: u.waxedAreaPerMetreM2,
    metres: u.metres,
    passes: u.passes,
    areaM2,
    grams: u.grams,
    gramsUsed: u.gramsUsed,
    potBeforeG: u.potBeforeG,
    potAfterG: u.potAfterG,
    potAddedG: u.potAddedG,
    rateGPerM2: areaM2 > 0 ? u.grams / areaM2 : 0,
    impressions,
    note: u.note,
    recordedByName: u.recordedByName,
    recordedAt: u.recordedAt.toISOString(),
    withdrawn: u.withdrawnAt ? { at: u.withdrawnAt.toISOString(), reason: u.withdrawnReason } : null,
  };
}

async function waxUseDtos(tx: Transaction | typeof db, rows: { use: WaxUseRow; recipeName: string }[]): Promise<WaxUseDto[]> {
  const ids = rows.map((r) => r.use.id);
  const impressions = ids.length ? await tx.select().from(waxUseImpressions).where(inArray(waxUseImpressions.waxUseId, ids)) : [];
  return rows.map((r) =>
    toUseDto(
      r.use,
      r.recipeName,
      impressions.filter((i) => i.waxUseId === r.use.id).map((i) => ({ stampCode: i.stampCode, impressions: i.impressions })),
    ),
  );
}

const waxUseRows = (tx: Transaction | typeof db) => tx.select({ use: waxUses, recipeName: waxRecipes.name }).from(waxUses).innerJoin(waxRecipes, eq(waxRecipes.id, waxUses.recipeId));

export async function listWaxUses(actor: Actor, query: WaxUseListQuery = {}, limit = 500): Promise<WaxUseDto[]> {
  assertCan(actor, "data:read");
  const rows = await waxUseRows(db)
    .where(and(query.recipeId ? eq(waxUses.recipeId, query.recipeId) : undefined, query.withdrawn === undefined ? undefined : query.withdrawn ? isNotNull(waxUses.withdrawnAt) : isNull(waxUses.withdrawnAt)))
    .orderBy(desc(waxUses.usedOn), desc(waxUses.recordedAt))
    .limit(limit);
  return waxUseDtos(db, rows);
}

export async function getWaxUse(actor: Actor, id: string): Promise<WaxUseDto> {
  assertCan(actor, "data:read");
  const rows = await waxUseRows(db).where(eq(waxUses.id, id));
  if (!rows.length) throw new AppError("notFound");
  return (await waxUseDtos(db, rows))[0];
}

/**
 * Records a wax use in one transaction: the use, a stock "use" movement per material of its recipe (kg = grams ×
 * mass share / 1000), and its impressions — for a plan, the plan's impressions per metre × metres × passes (the
 * back face on the stamp's mirror twin when it is one of a pair); without one, those the person gave for a stamp.
 * An archived recipe is refused (409 recipeArchived); an unknown recipe, plan or stamp code is a 422 on its field.
 */
export async function recordWaxUse(actor: Actor, input: RecordWaxUseInput): Promise<WaxUseDto> {
  assertCan(actor, "wax:write");
  // The schema refuses only days future everywhere; a wax use's day is the workshop's calendar day.
  if (input.usedOn > (await workshopToday())) throw new AppError("unprocessable", {}, { usedOn: ["validation.dateInFuture"] });
  const plan = input.planId ? await planForWax(actor, input.planId) : null;
  if (input.planId && !plan) throw new AppError("unprocessable", {}, { planId: ["wax.planUnknown"] });
  const id = await db.transaction(async (tx) => {
    let stampAdditions: ImpressionsToAdd[] = [];
    if (plan) {
      const made = impressionsOfWaxing(plan, input.metres, input.passes ?? 1);
      if (plan.stampId && made.total > 0) stampAdditions = [{ stampId: plan.stampId, impressions: made.front, backFace: made.back }];
    } else if (input.stampCode && input.impressions) {
      const [stamp] = await tx.select({ id: stamps.id }).from(stamps).where(eq(stamps.code, input.stampCode)).limit(1);
      if (!stamp) throw new AppError("unprocessable", {}, { stampCode: ["validation.stampNotFound"] });
      stampAdditions = [{ stampId: stamp.id, impressions: input.impressions }];
    }
    const waxedAreaPerMetreM2 = plan ? plan.waxedAreaPerMetreM2 : input.waxedAreaPerMetreM2!;
    return writeWaxUse(tx, actor, { ...input, waxedAreaPerMetreM2, planId: input.planId ?? null, runStageId: null }, stampAdditions, { kind: "waxUse" });
  });
  return getWaxUse(actor, id);
}

/** What writeWaxUse stores: the use's own fields, resolved (the area from the plan when there is one). */
export interface WaxUseToWrite {
  usedOn: string;
  planId: string | null;
  runStageId: string | null;
  recipeId: string;
  cloth?: string | null;
  waxedAreaPerMetreM2: number;
  metres: number;
  passes?: number;
  gramsUsed?: number;
  potBeforeG?: number;
  potAfterG?: number;
  potAddedG?: number;
  note?: string | null;
}

/**
 * Writes one wax use in the caller's transaction — the wax room's form and a production run's waxing stage both
 * come here, so they are the same record: the use, a stock "use" movement per material of its recipe (kg = grams
 * × mass share / 1000) and its impressions through the one writer of impression counts (kept per stamp so a
 * withdrawal takes them back). An unknown recipe → 422 on recipeId; an archived one → 409 recipeArchived.
 */
export async function writeWaxUse(
  tx: Transaction,
  actor: Actor,
  input: WaxUseToWrite,
  stampAdditions: readonly ImpressionsToAdd[],
  source: { kind: "waxUse" } | { kind: "runStage"; id: string },
): Promise<string> {
  const [recipe] = await loadRecipes(tx, [input.recipeId]);
  if (!recipe) throw new AppError("unprocessable", {}, { recipeId: ["wax.recipeUnknown"] });
  if (recipe.row.archivedAt) throw new AppError("recipeArchived", { name: recipe.row.name }, { recipeId: [{ key: "errors.recipeArchived", values: { name: recipe.row.name } }] });
  const grams = gramsOfUse(input);
  const [use] = await tx
    .insert(waxUses)
    .values({
      usedOn: input.usedOn,
      planId: input.planId,
      runStageId: input.runStageId,
      recipeId: recipe.row.id,
      cloth: input.cloth?.trim() || null,
      waxedAreaPerMetreM2: input.waxedAreaPerMetreM2,
      metres: input.metres,
      passes: input.passes ?? 1,
      gramsUsed: input.gramsUsed ?? null,
      potBeforeG: input.potBeforeG ?? null,
      potAfterG: input.potAfterG ?? null,
      potAddedG: input.potAddedG ?? null,
      grams,
      note: input.note ?? null,
      recordedBy: actor.id,
      recordedByName: actor.name,
    })
    .returning();

  if (grams > 0) {
    const fractions = massFractions(recipe.components);
    await tx.insert(waxStockMovements).values(
      recipe.components.map((c, i) => ({ materialId: c.materialId, kind: "use" as const, kg: -(grams * fractions[i]) / 1000, waxUseId: use.id, actorId: actor.id, actorName: actor.name })),
    );
  }
  if (stampAdditions.length) {
    const added = await addImpressions(tx, stampAdditions, source.kind === "runStage" ? source : { kind: "waxUse", id: use.id }, actor);
    const positive = added.filter((a) => a.impressions > 0);
    if (positive.length) await tx.insert(waxUseImpressions).values(positive.map((a) => ({ waxUseId: use.id, stampId: a.stampId, stampCode: a.code, impressions: a.impressions })));
  }
  return use.id;
}

/**
 * Withdraws a mistaken wax use: it stays on record (with who, when and why) but leaves the calibration, its wax
 * goes back into stock as corrections, and its impressions are taken back from the stamps. Twice → 409.
 */
export async function withdrawWaxUse(actor: Actor, id: string, input: WithdrawWaxUseInput): Promise<WaxUseDto> {
  assertCan(actor, "wax:write");
  await db.transaction(async (tx) => {
    const [use] = await tx.select().from(waxUses).where(eq(waxUses.id, id)).for("update");
    if (!use) throw new AppError("notFound");
    if (use.withdrawnAt) throw new AppError("waxUseWithdrawn");
    await tx.update(waxUses).set({ withdrawnAt: new Date(), withdrawnBy: actor.id, withdrawnReason: input.reason }).where(eq(waxUses.id, id));
    const moved = await tx.select().from(waxStockMovements).where(and(eq(waxStockMovements.waxUseId, id), eq(waxStockMovements.kind, "use")));
    if (moved.length) {
      await tx.insert(waxStockMovements).values(moved.map((m) => ({ materialId: m.materialId, kind: "correction" as const, kg: -m.kg, waxUseId: id, note: input.reason, actorId: actor.id, actorName: actor.name })));
    }
    const made = await tx.select().from(waxUseImpressions).where(eq(waxUseImpressions.waxUseId, id));
    const back = made.filter((m) => m.stampId).map((m) => ({ stampId: m.stampId!, impressions: -m.impressions }));
    if (back.length) await addImpressions(tx, back, { kind: "waxUse", id, withdrawn: true }, actor);
  });
  const result = getWaxUse(actor, id);
  audit("record.deleted", actor, { kind: "waxUse", id });
  return result;
}
