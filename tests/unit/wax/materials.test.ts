import { describe, expect, it } from "vitest";
import { DEFAULT_MATERIALS, materialSchema, recipeSchema, resolveMaterial } from "@/lib/wax";

const byId = (id: string) => {
  const m = DEFAULT_MATERIALS.find((x) => x.id === id);
  if (!m) throw new Error(`no default material ${id}`);
  return m;
};

describe("default materials", () => {
  it("are the seven the workshops use, each valid against the material schema", () => {
    expect(DEFAULT_MATERIALS.map((m) => m.id)).toEqual([
      "beeswax",
      "paraffin",
      "microcrystalline",
      "rosin",
      "damar",
      "animal-fat",
      "reclaimed",
    ]);
    for (const m of DEFAULT_MATERIALS) expect(materialSchema.parse(m)).toEqual(m);
  });

  it("carry the published figures of SOURCES.md", () => {
    // Beeswax: melts 62–64 °C, 0.958–0.970 g/cm³ at 15 °C, flash point 204 °C (others 254–274), discolours above
    // about 85 °C — encyclopedic entries; beekeeping references.
    const beeswax = byId("beeswax");
    expect(beeswax.meltingRangeC).toEqual({ fromC: 62, toC: 64 });
    expect(beeswax.densityGPerCm3).toBeGreaterThanOrEqual(0.958);
    expect(beeswax.densityGPerCm3).toBeLessThanOrEqual(0.97);
    expect(beeswax.flashPointC).toBe(204);
    expect(beeswax.discoloursAboveC).toBe(85);
    // Paraffin: melts about 46–68 °C, about 0.90 g/cm³, flash point about 200–240 °C — GESTIS via encyclopedic entries.
    const paraffin = byId("paraffin");
    expect(paraffin.meltingRangeC).toEqual({ fromC: 46, toC: 68 });
    expect(paraffin.densityGPerCm3).toBe(0.9);
    expect(paraffin.flashPointC).toBe(200);
    // Microcrystalline wax about 60–93 °C (ASTM D127 typical ranges); rosin 80–82 °C, damar 82–85 °C
    // (Indonesian batik-wax sources).
    expect(byId("microcrystalline").meltingRangeC).toEqual({ fromC: 60, toC: 93 });
    expect(byId("rosin").meltingRangeC).toEqual({ fromC: 80, toC: 82 });
    expect(byId("damar").meltingRangeC).toEqual({ fromC: 82, toC: 85 });
  });

  it("take the lowest flash point where sources disagree, and leave unknown ones null", () => {
    expect(byId("beeswax").sources.flashPoint).toMatch(/254–274/);
    expect(byId("paraffin").sources.flashPoint).toMatch(/200–240/);
    for (const id of ["microcrystalline", "rosin", "damar", "animal-fat", "reclaimed"]) {
      expect(byId(id).flashPointC, id).toBeNull();
      expect(byId(id).sources.flashPoint, id).toMatch(/safety data sheet/);
    }
  });

  it("name a source for every figure, 'from memory' or 'derived' where no published one exists", () => {
    for (const m of DEFAULT_MATERIALS) {
      for (const key of ["density", "melting", "flashPoint"] as const) expect(m.sources[key].length, `${m.id}.${key}`).toBeGreaterThan(10);
      expect(m.pricePerKg, m.id).toBeNull();
      expect(m.sources.price, m.id).toBe("a workshop setting; no default source");
    }
    for (const id of ["microcrystalline", "rosin", "damar"]) expect(byId(id).sources.density, id).toMatch(/from memory/);
    for (const id of ["animal-fat", "reclaimed"]) {
      for (const key of ["density", "melting", "flashPoint"] as const) {
        expect(byId(id).sources[key], `${id}.${key}`).toMatch(/no published figure in our sources/);
      }
    }
    expect(byId("animal-fat").sources.density).toMatch(/from memory/);
    expect(byId("reclaimed").sources.density).toMatch(/derived/);
  });

  it("give reclaimed wax the density of the 60/40 beeswax/paraffin mix (72/77 g/cm³, common practice mix)", () => {
    expect(byId("reclaimed").densityGPerCm3).toBeCloseTo(72 / 77, 3);
  });

  it("refuse a melting range that ends before it starts, or a negative price", () => {
    const beeswax = byId("beeswax");
    const bad = materialSchema.safeParse({ ...beeswax, meltingRangeC: { fromC: 70, toC: 60 }, pricePerKg: -1 });
    expect(bad.success).toBe(false);
    const messages = bad.error?.issues.map((i) => [i.path.join("."), i.message]);
    expect(messages).toContainEqual(["meltingRangeC.toC", "validation.rangeOrder"]);
    expect(messages).toContainEqual(["pricePerKg", "validation.tooSmall"]);
  });
});

describe("schemas without defaults", () => {
  it("let an update derived with .partial() change only what it names", () => {
    expect(materialSchema.partial().parse({ flashPointC: 190 })).toEqual({ flashPointC: 190 });
    expect(recipeSchema.partial().parse({ name: "Rainy" })).toEqual({ name: "Rainy" });
  });
});

describe("resolveMaterial", () => {
  it("finds a material by id, or by name or id case-insensitively", () => {
    expect(resolveMaterial("beeswax", DEFAULT_MATERIALS)?.id).toBe("beeswax");
    expect(resolveMaterial("  PARAFFIN wax ", DEFAULT_MATERIALS)?.id).toBe("paraffin");
    expect(resolveMaterial("Damar", DEFAULT_MATERIALS)?.id).toBe("damar");
    expect(resolveMaterial("candle ends", DEFAULT_MATERIALS)).toBeUndefined();
  });
});
