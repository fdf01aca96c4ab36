import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Database } from "@/db";
import {
  motifColourways,
  motifColours,
  motifEvents,
  motifs,
  plans,
  runEvents,
  runFindings,
  runPlans,
  runProgress,
  runReadings,
  runs,
  runStages,
  runStageStamps,
  stamps,
  waxMaterials,
  waxRecipeComponents,
  waxRecipes,
  waxStockMovements,
  waxUseImpressions,
  waxUses,
  type RunState,
} from "@/db/schema";
import { DEFAULT_IMPRESSIONS_PER_HOUR_PER_FACE } from "@/lib/plans/run";
import { defaultStages, stageNeed } from "@/lib/runs";
import { massFractions } from "@/lib/wax";

// Demo production runs (invented): four runs of the demo motifs in different states — one being prepared, one
// in work at its third stage with findings that flag a stamp (three "pooled" within the last days), one
// finished with its boil-off recorded, one stopped. Written as the API would: stage estimates from the wax
// estimator, a waxing's wax as a wax use with its stock movements and impressions. Idempotent by run name.

const DEMO = "Demo data";
const RATE_G_PER_M2 = 120;
const LOSS_PCT = 5;
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

interface DemoRun {
  name: string;
  state: RunState;
  metres: number | null;
  pieces: number | null;
  dueIn: number;
  stateNote?: string;
  /** Stages done, from the first. */
  done: number;
}

const demoRuns: DemoRun[] = [
  { name: "Harbour blues, two kodi of long cloths", state: "setup", metres: null, pieces: 40, dueIn: 24, done: 0 },
  { name: "Market cream and soga, 30 m", state: "underway", metres: 30, pieces: null, dueIn: 9, done: 2 },
  { name: "Dry season sarongs, 20 m", state: "complete", metres: 20, pieces: null, dueIn: -5, done: 99 },
  { name: "Trial on export cotton, 12 m", state: "halted", metres: 12, pieces: null, dueIn: 14, done: 1, stateNote: "The cotton took the indigo unevenly; waiting for another bolt." },
];

export async function seedRuns(db: Database) {
  const have = new Set((await db.select({ name: runs.name }).from(runs)).map((r) => r.name));
  if (demoRuns.every((r) => have.has(r.name))) return;
  // The demo motifs (those the motif seed created), the demo plan and recipe, not whatever else is stored.
  const [motif] = await db
    .select({ id: motifs.id, colourwayId: motifColourways.id })
    .from(motifs)
    .innerJoin(motifColourways, eq(motifColourways.motifId, motifs.id))
    .innerJoin(motifEvents, and(eq(motifEvents.motifId, motifs.id), eq(motifEvents.kind, "created"), eq(motifEvents.actorName, DEMO)))
    .orderBy(asc(motifs.name), asc(motifColourways.position))
    .limit(1);
  const [plan] = await db.select().from(plans).where(eq(plans.name, "Market run, straight on mori 106")).limit(1);
  const [recipe] = await db.select().from(waxRecipes).where(and(eq(waxRecipes.name, "Dry-season stamp wax"), isNull(waxRecipes.archivedAt))).limit(1);
  if (!motif || !plan || !recipe) return;
  const components = await db
    .select({ materialId: waxRecipeComponents.materialId, pct: waxRecipeComponents.pct, densityGPerCm3: waxMaterials.densityGPerCm3, pricePerKg: waxMaterials.pricePerKg })
    .from(waxRecipeComponents)
    .innerJoin(waxMaterials, eq(waxMaterials.id, waxRecipeComponents.materialId))
    .where(eq(waxRecipeComponents.recipeId, recipe.id))
    .orderBy(asc(waxRecipeComponents.line));
  const colours = await db.select().from(motifColours).where(eq(motifColours.colourwayId, motif.colourwayId)).orderBy(asc(motifColours.position));
  const stampIds = [...new Set(colours.flatMap((c) => c.waxStampIds))];
  const stampRows = stampIds.length ? await db.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.id, stampIds)) : [];
  const codeOf = new Map(stampRows.map((s) => [s.id, s.code]));
  const idOf = new Map(stampRows.map((s) => [s.code, s.id]));
  const stages = defaultStages(colours.map((c) => ({ position: c.position, name: c.name, swatch: c.swatch, face: c.face, bleach: c.bleach, waxStamps: c.waxStampIds.flatMap((id) => (codeOf.has(id) ? [codeOf.get(id)!] : [])) })));
  const summary = plan.summary as { waxedAreaPerMetreM2: number; impressionsTotal: number; runLengthMm: number };
  const fractions = massFractions(components.map((c) => ({ material: c.materialId, pct: c.pct })));

  for (const demo of demoRuns) {
    if (have.has(demo.name)) continue;
    const metres = demo.metres ?? ((demo.pieces ?? 0) * 2650) / 1000;
    await db.transaction(async (tx) => {
      const [run] = await tx
        .insert(runs)
        .values({
          name: demo.name,
          motifId: motif.id,
          colourwayId: motif.colourwayId,
          cloth: "mori primissima 115 cm",
          metres: demo.metres,
          pieces: demo.pieces,
          pieceLengthMm: demo.pieces ? 2650 : null,
          dueOn: day(demo.dueIn),
          state: demo.state,
          stateNote: demo.stateNote ?? null,
          createdByName: DEMO,
          updatedByName: DEMO,
        })
        .returning();
      await tx.insert(runPlans).values({ runId: run.id, planId: plan.id });
      await tx.insert(runEvents).values({ runId: run.id, kind: "created", actorName: DEMO, version: 1 });
      let waxedGrams = 0;
      for (const [position, s] of stages.entries()) {
        const need =
          s.kind === "wax"
            ? stageNeed({
                plan: { waxedAreaPerMetreM2: summary.waxedAreaPerMetreM2, impressionsTotal: summary.impressionsTotal, runLengthMm: summary.runLengthMm, sides: plan.sides === 2 ? 2 : 1 },
                metres,
                pieces: demo.pieces ?? Math.round(metres),
                passes: 1,
                rateGPerM2: RATE_G_PER_M2,
                lossPct: LOSS_PCT,
                components: components.map((c) => ({ material: c.materialId, pct: c.pct, densityGPerCm3: c.densityGPerCm3, pricePerKg: c.pricePerKg })),
                impressionsPerHour: DEFAULT_IMPRESSIONS_PER_HOUR_PER_FACE,
              })
            : null;
        const done = position < demo.done || demo.state === "complete";
        const start = demo.dueIn - 2 * (stages.length - position);
        const [stage] = await tx
          .insert(runStages)
          .values({
            runId: run.id,
            position,
            kind: s.kind,
            state: done ? "done" : "planned",
            colourPosition: s.colourPosition,
            colourName: s.colourName,
            swatch: s.swatch,
            plannedStartOn: day(start),
            plannedEndOn: day(start + 1),
            waxMethod: s.waxMethod,
            planId: s.kind === "wax" ? plan.id : null,
            recipeId: s.kind === "wax" ? recipe.id : null,
            faces: s.faces,
            dyeMethod: s.dyeMethod,
            estimate: need ? { gramsPerMetre: need.gramsPerMetre, rateGPerM2: RATE_G_PER_M2, rateBasis: "default", lossPct: LOSS_PCT, byMaterial: need.byMaterial, metres } : null,
            kgEstimated: need?.kgEstimated ?? 0,
            impressionsEstimated: need?.impressions ?? 0,
            hoursEstimated: need?.hours ?? 0,
          })
          .returning();
        const stageStamps = s.stamps.filter((x) => idOf.has(x.code));
        if (stageStamps.length) await tx.insert(runStageStamps).values(stageStamps.map((x) => ({ stageId: stage.id, stampId: idOf.get(x.code)!, face: x.face })));
        if (!done) continue;
        const doneOn = day(Math.min(-1, start));
        if (s.kind === "wax" && need) {
          // What the pot said: the estimate give or take a little, as a real waxing would.
          const grams = Math.round(need.kgEstimated * 1000 * (0.94 + 0.03 * position));
          waxedGrams += grams;
          const [use] = await tx
            .insert(waxUses)
            .values({
              usedOn: doneOn,
              planId: plan.id,
              runStageId: stage.id,
              recipeId: recipe.id,
              cloth: run.cloth,
              waxedAreaPerMetreM2: summary.waxedAreaPerMetreM2,
              metres,
              passes: 1,
              potBeforeG: grams + 1500,
              potAfterG: 1500,
              grams,
              recordedByName: DEMO,
            })
            .returning();
          await tx.insert(waxStockMovements).values(components.map((c, i) => ({ materialId: c.materialId, kind: "use" as const, kg: -(grams * fractions[i]) / 1000, waxUseId: use.id, actorName: DEMO })));
          const stampId = stageStamps[0] ? idOf.get(stageStamps[0].code)! : plan.stampId;
          if (stampId && need.impressions > 0) {
            const [st] = await tx.update(stamps).set({ impressionsCount: sql`${stamps.impressionsCount} + ${need.impressions}` }).where(eq(stamps.id, stampId)).returning({ code: stamps.code });
            await tx.insert(waxUseImpressions).values({ waxUseId: use.id, stampId, stampCode: st.code, impressions: need.impressions });
          }
          await tx.insert(runProgress).values({ stageId: stage.id, doneOn, metres, impressions: need.impressions, waxUseId: use.id, potBeforeG: grams + 1500, potAfterG: 1500, waxUsedG: grams, recordedByName: DEMO });
          await tx.insert(runReadings).values([
            { stageId: stage.id, tempC: Math.min(recipe.workingMaxC, 68), recordedByName: DEMO },
            { stageId: stage.id, tempC: Math.min(recipe.workingMaxC, 70) - 1, recordedByName: DEMO },
          ]);
        } else if (s.kind === "boil_off") {
          // About seven tenths came back: an invented figure, not a published one.
          const recovered = Math.round(waxedGrams * 0.7);
          await tx.insert(runProgress).values({ stageId: stage.id, doneOn, metres, recoveredG: recovered, recordedByName: DEMO });
          if (recovered > 0) await tx.insert(waxStockMovements).values(components.map((c, i) => ({ materialId: c.materialId, kind: "recovery" as const, kg: (recovered * fractions[i]) / 1000, note: run.name, actorName: DEMO })));
        } else {
          await tx.insert(runProgress).values({ stageId: stage.id, doneOn, metres, recordedByName: DEMO });
        }
      }
      if (demo.state === "underway" && stampRows.length) {
        // Three pools of wax from the same stamp within a week: the stamp is flagged for the keepers.
        const stamp = stampRows[0];
        await tx.insert(runFindings).values(
          [3, 2, 1].map((ago, i) => ({
            runId: run.id,
            foundOn: day(-ago),
            kind: "pooled" as const,
            location: `piece ${i + 2}, near the right selvedge`,
            count: 1 + i,
            stampId: stamp.id,
            stampCode: stamp.code,
            repair: "lifted" as const,
            repairNote: "Lifted with the hot knife before dyeing.",
            recordedByName: DEMO,
          })),
        );
        await tx.insert(runFindings).values({ runId: run.id, foundOn: day(-1), kind: "thin", location: "piece 5", count: 2, repair: "filled", recordedByName: DEMO });
      }
    });
  }
}
