import { eq, inArray } from "drizzle-orm";
import type { Database } from "@/db";
import { motifCollectionMembers, motifCollections, motifColours, motifColourways, motifEvents, motifs, motifStamps, stamps } from "@/db/schema";
import { demoStamps } from "./stamps";

// Demo motif archive: a dozen invented motifs in two invented collections, each carried by demo stamps that have
// scans (the first 30 by code), with colourways. Idempotent by motif and collection name.

const collections = [
  { name: "Dry Season Sampler", season: "Dry season", year: 2025, description: "Light grounds and a single indigo dip." },
  { name: "Harbour Lights", season: null, year: 2026, description: "Two-dye designs for the coming year." },
];

const words = [
  ["Terrace Rain", ["geometric", "rain", "modern"]],
  ["Pond Lotus", ["floral", "lotus", "classic"]],
  ["Climbing Vine", ["floral", "vine", "classic"]],
  ["Night Stars", ["geometric", "stars", "modern"]],
  ["River Bands", ["geometric", "water", "modern"]],
  ["Garden Petals", ["floral", "petals", "classic"]],
  ["Morning Buds", ["floral", "buds", "modern"]],
  ["Tide Lines", ["geometric", "water", "classic"]],
  ["Lantern Grid", ["geometric", "lantern", "modern"]],
  ["Quiet Leaves", ["floral", "leaves", "classic"]],
  ["Kite Festival", ["figurative", "kites", "modern"]],
  ["Old Courtyard", ["geometric", "tiles", "classic"]],
] as const;

const designers = ["Sekar Anindita", "Galih Pramana", "Laras Wicaksari"];

const palettes = [
  [
    ["Undyed mori", "#f4efe6", "The cloth's own white, kept under the first wax."],
    ["Soga brown", "#8a5a2b", "Two dips, dried between."],
    ["Indigo", "#1f3a5f", "Last dip; the wax cracks a little here."],
  ],
  [
    ["Undyed mori", "#f4efe6", null],
    ["Sky blue", "#6f9fc8", "One short dip."],
    ["Deep indigo", "#15243d", "Three dips."],
  ],
] as const;

export async function seedMotifs(db: Database) {
  const existing = await db.select({ name: motifs.name }).from(motifs);
  const have = new Set(existing.map((m) => m.name));
  if (words.every(([name]) => have.has(name))) return;

  const collectionIds: string[] = [];
  for (const c of collections) {
    const [found] = await db.select({ id: motifCollections.id }).from(motifCollections).where(eq(motifCollections.name, c.name));
    collectionIds.push(found?.id ?? (await db.insert(motifCollections).values(c).returning({ id: motifCollections.id }))[0].id);
  }

  const plan = demoStamps();
  const scanned = plan.slice(0, 30);
  const mains = scanned.filter((s) => (s.tags ?? []).includes("main") && !s.mirrored);
  const borders = plan.filter((s) => (s.tags ?? []).includes("border"));
  const fillers = plan.filter((s) => (s.tags ?? []).includes("filler"));
  const corners = plan.filter((s) => (s.tags ?? []).includes("corner"));
  const codes = [...new Set([...mains, ...borders, ...fillers, ...corners, ...scanned].map((s) => s.code))];
  const ids = new Map((await db.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.code, codes))).map((r) => [r.code, r.id]));

  for (const [i, [name, tags]] of words.entries()) {
    if (have.has(name)) continue;
    const main = mains[i % mains.length];
    const set: { code: string; role: "main" | "reverse_twin" | "border" | "filler" | "corner" }[] = [{ code: main.code, role: "main" }];
    if (main.twinCode) set.push({ code: main.twinCode, role: "reverse_twin" });
    if (i % 2 === 0 && borders.length) set.push({ code: borders[i % borders.length].code, role: "border" });
    if (i % 3 === 0 && fillers.length) set.push({ code: fillers[i % fillers.length].code, role: "filler" });
    if (i % 4 === 1 && corners.length) set.push({ code: corners[i % corners.length].code, role: "corner" });
    const stampSet = set.filter((s) => ids.has(s.code));
    await db.transaction(async (tx) => {
      const [motif] = await tx
        .insert(motifs)
        .values({
          name,
          tags: [...tags],
          designer: designers[i % designers.length],
          description: `An invented ${tags[0]} design of ${tags[1]}, for the demo archive.`,
          firstUsedOn: `${2012 + (i % 12)}-${String(1 + (i % 12)).padStart(2, "0")}-15`,
        })
        .returning({ id: motifs.id });
      await tx.insert(motifCollectionMembers).values({ motifId: motif.id, collectionId: collectionIds[i % 2] });
      if (stampSet.length) await tx.insert(motifStamps).values(stampSet.map((s, position) => ({ motifId: motif.id, stampId: ids.get(s.code)!, role: s.role, position })));
      for (const s of stampSet) await tx.update(stamps).set({ motifId: motif.id }).where(eq(stamps.id, ids.get(s.code)!));
      const ways = i % 3 === 2 ? [0] : [0, 1];
      for (const [position, p] of ways.entries()) {
        const [way] = await tx
          .insert(motifColourways)
          .values({ motifId: motif.id, name: position === 0 ? "Brown and indigo" : "Two blues", position })
          .returning({ id: motifColourways.id });
        await tx.insert(motifColours).values(
          palettes[p].map(([colour, swatch, dyeNotes], k) => ({
            colourwayId: way.id,
            position: k,
            name: colour,
            swatch,
            dyeNotes,
            face: k === 0 ? ("both" as const) : ("front" as const),
            waxStampIds: k < palettes[p].length - 1 ? [ids.get(main.code)!] : [],
          })),
        );
      }
      await tx.insert(motifEvents).values({ motifId: motif.id, kind: "created", actorName: "Demo data" });
    });
  }
}
