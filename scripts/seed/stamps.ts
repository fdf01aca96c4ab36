import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Database } from "@/db";
import { checkouts, damageReports, locations, stampEvents, stamps, users, type NewStamp } from "@/db/schema";

/**
 * The invented stamp library of the demo workshop: two sites, about 150 copper stamps of
 * plausible sizes (mostly 18–30 cm, some small fillers and long borders), a few pairs with
 * mirror twins, some worn or waiting for repair, a few checked out and one overdue.
 * Deterministic (a fixed pseudo-random sequence), so every run makes the same library.
 */

export const demoSites = ["Griya Kidul", "Gudang Lor"] as const;

interface DemoCheckout {
  code: string;
  borrowerName: string;
  borrowerEmail: string;
  workstation: string;
  /** Days from today; negative = overdue. */
  dueInDays: number;
  outDaysAgo: number;
}

const demoCheckouts: DemoCheckout[] = [
  { code: "CP-0003", borrowerName: "Ratri Handayani", borrowerEmail: "ratri@capgrid.test", workstation: "Stamping table 2", dueInDays: 4, outDaysAgo: 3 },
  { code: "CP-0012", borrowerName: "Ratri Handayani", borrowerEmail: "ratri@capgrid.test", workstation: "Stamping table 2", dueInDays: 4, outDaysAgo: 3 },
  { code: "CP-0027", borrowerName: "Bayu Kurniawan", borrowerEmail: "bayu@capgrid.test", workstation: "Stamping table 5", dueInDays: 1, outDaysAgo: 6 },
  { code: "CP-0044", borrowerName: "Wulan Sasmita", borrowerEmail: "wulan@capgrid.test", workstation: "Sample corner", dueInDays: 10, outDaysAgo: 1 },
  { code: "CP-0058", borrowerName: "Bayu Kurniawan", borrowerEmail: "bayu@capgrid.test", workstation: "Stamping table 5", dueInDays: -3, outDaysAgo: 12 },
];


export function demoLocations(): { site: string; code: string; description: string | null }[] {
  const list: { site: string; code: string; description: string | null }[] = [];
  for (let rack = 1; rack <= 4; rack++) for (let shelf = 1; shelf <= 4; shelf++) list.push({ site: demoSites[0], code: `R${rack}-S${shelf}`, description: shelf === 1 ? "bottom shelf, heavy stamps" : null });
  for (let rack = 1; rack <= 3; rack++) for (let shelf = 1; shelf <= 3; shelf++) list.push({ site: demoSites[1], code: `R${rack}-S${shelf}`, description: null });
  list.push({ site: demoSites[0], code: "BENCH", description: "repair bench by the back door" });
  return list;
}

const families = ["Kawung", "Parang", "Truntum", "Ceplok", "Lereng", "Semen", "Sekar jagad", "Buketan", "Nitik", "Tambal", "Gringsing", "Sido mukti"];
const qualifiers = ["large", "small", "open", "dense", "old", "new cut", "leafy", "with birds", "star", "wave", "flower", "lattice"];
const makers = ["Pak Harjo Sumitro", "Bu Sastro Wiyono", "Pak Darmo Sugito", "Mas Yudi Pranoto", "Pak Wiryo Atmojo", null];

/** A small fixed-sequence generator (Park–Miller), so the demo is the same on every machine. */
function sequence(seed: number) {
  let state = seed;
  return () => {
    state = (state * 48271) % 2147483647;
    return state / 2147483647;
  };
}

export interface DemoStamp extends Omit<NewStamp, "locationId" | "twinId"> {
  code: string;
  /** Index into demoLocations(), or null. */
  locationIndex: number | null;
  twinCode: string | null;
}

/** `count` invented stamps; codes CP-0001, CP-0002, … */
export function demoStamps(count = 150, seed = 20_260_301): DemoStamp[] {
  const random = sequence(seed);
  const pick = <T,>(list: readonly T[]) => list[Math.floor(random() * list.length)];
  const locationCount = demoLocations().length - 1; // the bench holds only stamps in repair
  const width = String(count).length > 4 ? String(count).length : 4;
  const list: DemoStamp[] = [];
  for (let i = 1; i <= count; i++) {
    const code = `CP-${String(i).padStart(width, "0")}`;
    const kind = random();
    const family = pick(families);
    let w: number, h: number, role: string;
    if (kind < 0.1) {
      role = "filler";
      w = 60 + Math.round(random() * 60);
      h = w + Math.round((random() - 0.5) * 10);
    } else if (kind < 0.2) {
      role = "border";
      w = 280 + Math.round(random() * 40);
      h = 70 + Math.round(random() * 30);
    } else if (kind < 0.25) {
      role = "corner";
      w = 120 + Math.round(random() * 40);
      h = w;
    } else {
      role = "main";
      w = 180 + Math.round(random() * 120);
      h = random() < 0.7 ? w : 180 + Math.round(random() * 120);
    }
    const c = random();
    const condition = c < 0.72 ? "sound" : c < 0.88 ? "worn" : c < 0.93 ? "needs_repair" : c < 0.96 ? "in_repair" : "retired";
    const year = 1955 + Math.floor(random() * 68);
    const month = 1 + Math.floor(random() * 12);
    list.push({
      code,
      name: `${family} ${role === "main" ? pick(qualifiers) : role}`,
      widthMm: w,
      heightMm: h,
      stripDepthMm: Math.round((8 + random() * 10) * 10) / 10,
      weightG: Math.round((w * h) / 60 + 150 + random() * 200),
      face: "single",
      mirrored: false,
      maker: pick(makers),
      madeOn: `${year}-${String(month).padStart(2, "0")}-01`,
      condition,
      locationIndex: condition === "in_repair" ? locationCount : random() < 0.97 ? Math.floor(random() * locationCount) : null,
      coverageRatio: random() < 0.6 ? Math.round((0.2 + random() * 0.45) * 100) / 100 : null,
      impressionsCount: Math.floor(random() * 40_000),
      notes: condition === "worn" ? "Face worn at the edges; print lighter there." : null,
      tags: [family.toLowerCase(), role],
      twinCode: null,
    });
  }
  // Every ninth stamp with a main motif gets a mirror twin right after it (pairs for both faces).
  for (let i = 0; i + 1 < list.length; i += 9) {
    const front = list[i];
    const back = list[i + 1];
    Object.assign(back, { name: `${front.name} (back)`, widthMm: front.widthMm, heightMm: front.heightMm, tags: front.tags });
    for (const [s, mirrored, twin] of [
      [front, false, back.code],
      [back, true, front.code],
    ] as const) {
      Object.assign(s, { face: "pair", mirrored, twinCode: twin });
    }
  }
  // The stamps the demo has out must be fit to go out.
  for (const c of demoCheckouts) {
    const s = list.find((x) => x.code === c.code);
    if (s && s.condition !== "sound" && s.condition !== "worn") Object.assign(s, { condition: "sound", locationIndex: 0, notes: null });
  }
  return list;
}

const isoDay = (daysFromToday: number) => new Date(Date.now() + daysFromToday * 86_400_000).toISOString().slice(0, 10);

/**
 * Adds what is missing of the demo library (idempotent): locations by (site, code), stamps by
 * code, their "created" history, twin links, the demo check-outs and one open damage report.
 * `count` > 150 makes a bigger library of the same kind (for benchmarks).
 */
export async function seedStamps(db: Database, options: { count?: number; keeperEmail?: string } = {}) {
  const locationRows = demoLocations();
  await db.insert(locations).values(locationRows).onConflictDoNothing();
  const stored = await db.select().from(locations).where(inArray(locations.site, [...demoSites]));
  const locationId = (index: number | null) => {
    if (index === null) return null;
    const l = locationRows[index];
    return stored.find((s) => s.site === l.site && s.code === l.code)?.id ?? null;
  };

  const [keeper] = await db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(eq(sql`lower(${users.email})`, (options.keeperEmail ?? "joko@capgrid.test").toLowerCase()))
    .limit(1);
  const actor = keeper ?? { id: null, name: "Demo data" };

  const list = demoStamps(options.count ?? 150);
  const inserted: { id: string; code: string }[] = [];
  for (let i = 0; i < list.length; i += 500) {
    const batch = list.slice(i, i + 500).map(({ locationIndex, twinCode: _twin, ...s }) => {
      void _twin;
      return { ...s, locationId: locationId(locationIndex) };
    });
    inserted.push(...(await db.insert(stamps).values(batch).onConflictDoNothing().returning({ id: stamps.id, code: stamps.code })));
  }
  for (let i = 0; i < inserted.length; i += 1000) {
    await db.insert(stampEvents).values(inserted.slice(i, i + 1000).map((s) => ({ stampId: s.id, kind: "created" as const, actorId: actor.id, actorName: actor.name, toValue: s.code })));
  }

  // Twins: only where neither side is linked yet.
  const ids = new Map((await db.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.code, list.filter((s) => s.twinCode).map((s) => s.code)))).map((r) => [r.code, r.id]));
  for (const s of list) {
    if (!s.twinCode || !ids.get(s.twinCode) || !ids.get(s.code)) continue;
    await db.update(stamps).set({ twinId: ids.get(s.twinCode)! }).where(and(eq(stamps.code, s.code), isNull(stamps.twinId)));
  }

  const wanted = demoCheckouts.filter((c) => list.some((s) => s.code === c.code && (s.condition === "sound" || s.condition === "worn")));
  for (const c of wanted) {
    const [stamp] = await db.select({ id: stamps.id }).from(stamps).where(eq(stamps.code, c.code));
    if (!stamp) continue;
    const [any] = await db.select({ id: checkouts.id }).from(checkouts).where(eq(checkouts.stampId, stamp.id)).limit(1);
    if (any) continue;
    const outAt = new Date(Date.now() - c.outDaysAgo * 86_400_000);
    await db.insert(checkouts).values({
      stampId: stamp.id,
      borrowerName: c.borrowerName,
      borrowerEmail: c.borrowerEmail,
      workstation: c.workstation,
      outAt,
      dueOn: isoDay(c.dueInDays),
      checkedOutBy: actor.id,
    });
    await db.insert(stampEvents).values({
      stampId: stamp.id,
      kind: "checked_out",
      actorId: actor.id,
      actorName: actor.name,
      at: outAt,
      toValue: c.borrowerName,
      details: { workstation: c.workstation, dueOn: isoDay(c.dueInDays) },
    });
  }

  // One open damage report on the first stamp that waits for repair.
  const needing = list.find((s) => s.condition === "needs_repair");
  if (needing) {
    const [stamp] = await db.select({ id: stamps.id }).from(stamps).where(eq(stamps.code, needing.code));
    const [any] = stamp ? await db.select({ id: damageReports.id }).from(damageReports).where(eq(damageReports.stampId, stamp.id)).limit(1) : [undefined];
    if (stamp && !any) {
      await db.insert(damageReports).values({ stampId: stamp.id, kind: "cracked_solder", note: "Two strips came loose at the top corner.", reportedBy: actor.id });
      await db.insert(stampEvents).values({ stampId: stamp.id, kind: "damage_reported", actorId: actor.id, actorName: actor.name, toValue: "cracked_solder", note: "Two strips came loose at the top corner." });
    }
  }
  return { stamps: inserted.length };
}
