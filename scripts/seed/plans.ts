import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { Database } from "@/db";
import { planEvents, planStamps, plans, stamps, users } from "@/db/schema";
import { layoutOf, type StampSize } from "@/lib/layout";
import { engineStampOf, geometryRecord, planSummary, resolveLayoutRequest, stampCodesOf, type LayoutRequestLike } from "@/lib/plans";
import { fingerprintOf, outlineDigest } from "@/lib/plans/digest";
import { planLayoutSchema } from "@/lib/validation/plans";
import { bordersListRequestSchema } from "@/lib/validation/layout";

// Demo cloth plans (invented): seven plans across the demo stamps — straight, half-drop, brick, diagonal, turnover,
// one with borders down both selvedges and one waxed on both faces with a mirror-twin pair. Idempotent by name.
// Computed with the same engine and fingerprints as a save through the API.

interface DemoPlan {
  name: string;
  notes: string;
  layout: Record<string, unknown>;
  borders?: Record<string, unknown>[];
}

const mori106 = { widthMm: 1060, margins: { leftMm: 0, rightMm: 0 } };
const mori115 = { widthMm: 1150, margins: { leftMm: 0, rightMm: 0 } };
const cotton44 = { widthMm: 1117.6, margins: { leftMm: 25.4, rightMm: 25.4 } };

function demoPlans(main: string[], pair: string | null, border: string | null): DemoPlan[] {
  const list: DemoPlan[] = [
    {
      name: "Market run, straight on mori 106",
      notes: "The everyday cloth: 30 m in one length.",
      layout: { cloth: { ...mori106, lengthMm: 30_000 }, stamp: { code: main[0] }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" },
    },
    {
      name: "Two kodi of long cloths, half-drop",
      notes: "40 pieces of 2.65 m on mori 115.",
      layout: { cloth: { ...mori115, pieces: 40, pieceLengthMm: 2650 }, stamp: { code: main[1] }, gap: { xMm: 5, yMm: 0 }, arrangement: "half-drop" },
    },
    {
      name: "Export cotton, brick",
      notes: "44 in cotton with 1 in margins, 50 yd.",
      layout: { cloth: { ...cotton44, lengthMm: 45_720 }, stamp: { code: main[2] }, gap: { xMm: 0, yMm: 0 }, arrangement: "brick", edges: "clip" },
    },
    {
      name: "Diagonal sample, a third a row",
      notes: "A sample length to judge the diagonal before a run.",
      layout: { cloth: { ...mori106, lengthMm: 5_000 }, stamp: { code: main[3] }, gap: { xMm: 0, yMm: 0 }, arrangement: "diagonal", diagonalStep: 1 / 3, edges: "clip" },
    },
    {
      name: "Free footprint trial, turnover",
      notes: "A stamp not cut yet: 250 mm square, about a third waxed.",
      layout: { cloth: { ...mori115, lengthMm: 10_000 }, stamp: { widthMm: 250, heightMm: 250, coverage: 0.35 }, gap: { xMm: -10, yMm: -10 }, arrangement: "turnover" },
    },
  ];
  if (border) {
    list.push({
      name: "Sarong with borders down both selvedges",
      notes: "The border stamp turned a quarter, mirrored on the right.",
      layout: { cloth: { ...mori115, pieces: 20, pieceLengthMm: 2000 }, stamp: { code: main[4] }, gap: { xMm: 0, yMm: 0 }, arrangement: "mirror" },
      borders: [{ side: "both", stamp: { code: border }, turn: 90, gapYMm: 5, gapToFieldMm: 15 }],
    });
  }
  if (pair) {
    list.push({
      name: "Both faces, front and mirror twin",
      notes: "Waxed on the front and again on the back with the stamp's mirror twin.",
      layout: { cloth: { ...mori106, pieces: 20, pieceLengthMm: 2500 }, stamp: { code: pair }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight", sides: 2 },
    });
  }
  return list;
}

export async function seedPlans(db: Database) {
  const [planner] = await db.select().from(users).where(eq(users.email, "laras@capgrid.test"));
  const sound = inArray(stamps.condition, ["sound", "worn"]);
  const main = await db
    .select({ code: stamps.code })
    .from(stamps)
    .where(and(sound, sql`'main' = ANY(${stamps.tags})`, eq(stamps.face, "single"), sql`${stamps.widthMm} <= 260`))
    .orderBy(asc(stamps.code))
    .limit(5);
  if (main.length < 5) return; // no demo library
  const [pair] = await db.select({ code: stamps.code }).from(stamps).where(and(sound, eq(stamps.face, "pair"), eq(stamps.mirrored, false))).orderBy(asc(stamps.code)).limit(1);
  const [border] = await db.select({ code: stamps.code }).from(stamps).where(and(sound, sql`'border' = ANY(${stamps.tags})`)).orderBy(asc(stamps.code)).limit(1);

  const existing = new Set((await db.select({ name: plans.name }).from(plans)).map((p) => p.name));
  for (const demo of demoPlans(
    main.map((s) => s.code),
    pair?.code ?? null,
    border?.code ?? null,
  )) {
    if (existing.has(demo.name)) continue;
    const layout = planLayoutSchema.parse(demo.layout);
    const borders = bordersListRequestSchema.parse(demo.borders ?? []);
    const request = { ...layout, borders } as unknown as LayoutRequestLike;
    const codes = stampCodesOf(request);
    const rows = codes.length ? await db.select().from(stamps).where(inArray(stamps.code, codes.map((c) => c.code))) : [];
    const byCode = new Map(rows.map((r) => [r.code, r]));
    const geometry = new Map<string, StampSize>(rows.map((r) => [r.code, engineStampOf(r)]));
    const summary = planSummary(layoutOf({ ...resolveLayoutRequest(request, geometry), impressions: false, preview: false }));
    const records = codes.map((c) => geometryRecord(c.role, c.code, geometry.get(c.code)!, outlineDigest));
    await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(plans)
        .values({
          name: demo.name,
          notes: demo.notes,
          stampId: codes.find((c) => c.role === "field") ? byCode.get(codes.find((c) => c.role === "field")!.code)!.id : null,
          layout: layout as unknown as Record<string, unknown>,
          borders: borders as unknown as Record<string, unknown>[],
          arrangement: layout.arrangement,
          clothWidthMm: layout.cloth.widthMm,
          sides: layout.sides,
          summary: summary as unknown as Record<string, unknown>,
          impressionsPerMetre: summary.impressionsPerMetre,
          waxedAreaPerMetreM2: summary.waxedAreaPerMetreM2,
          stampGeometry: records as unknown as Record<string, unknown>[],
          geometryFingerprint: fingerprintOf(records),
          createdBy: planner?.id ?? null,
          createdByName: planner?.name ?? "Demo planner",
          updatedBy: planner?.id ?? null,
          updatedByName: planner?.name ?? "Demo planner",
        })
        .returning();
      if (codes.length) await tx.insert(planStamps).values(codes.map((c) => ({ planId: row.id, stampId: byCode.get(c.code)!.id, role: c.role })));
      await tx.insert(planEvents).values({ planId: row.id, kind: "created", actorId: planner?.id ?? null, actorName: planner?.name ?? "Demo planner", version: 1, details: { demo: true } });
    });
  }
}
