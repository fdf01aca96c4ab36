import { describe, expect, it } from "vitest";
import { canBeCheckedOut, canChangeCondition, isRepair, needsToBeIn, nextConditions, type Condition } from "@/lib/stamps/condition";

const all: Condition[] = ["sound", "worn", "needs_repair", "in_repair", "retired"];

describe("condition path", () => {
  it("goes needs repair → in repair → sound, the way keepers repair a stamp", () => {
    expect(canChangeCondition("sound", "needs_repair")).toBe(true);
    expect(canChangeCondition("needs_repair", "in_repair")).toBe(true);
    expect(canChangeCondition("in_repair", "sound")).toBe(true);
    expect(isRepair("in_repair", "sound")).toBe(true);
    expect(isRepair("in_repair", "worn")).toBe(true);
  });

  it("does not skip the report: a sound stamp cannot go straight into repair", () => {
    expect(canChangeCondition("sound", "in_repair")).toBe(false);
    expect(canChangeCondition("worn", "in_repair")).toBe(false);
    expect(isRepair("needs_repair", "sound")).toBe(false);
  });

  it("never lists the current condition as a next one, and every stamp can be retired or brought back", () => {
    for (const c of all) {
      expect(nextConditions(c)).not.toContain(c);
      if (c !== "retired") expect(canChangeCondition(c, "retired")).toBe(true);
    }
    expect(canChangeCondition("retired", "sound")).toBe(true);
  });

  it("only sound and worn stamps go out; repair and retirement need the stamp back first", () => {
    expect(all.filter(canBeCheckedOut)).toEqual(["sound", "worn"]);
    expect(all.filter(needsToBeIn)).toEqual(["in_repair", "retired"]);
  });
});
