import { describe, expect, it } from "vitest";
import { daysOverlap, scheduleStages, stageDays, STAMPER_HOURS_PER_DAY } from "@/lib/runs";

describe("stage days", () => {
  it("spreads a waxing's stamper hours over seven-hour days (common practice), at least one", () => {
    expect(STAMPER_HOURS_PER_DAY).toBe(7);
    expect(stageDays({ kind: "wax", hours: 0 })).toBe(1);
    expect(stageDays({ kind: "wax", hours: 7 })).toBe(1);
    expect(stageDays({ kind: "wax", hours: 7.01 })).toBe(2);
    // 20 h by two stampers: 20 / 14 → 2 days
    expect(stageDays({ kind: "wax", hours: 20 }, 2)).toBe(2);
  });
  it("gives a dye bath a day and a day to dry, the others one day (common practice)", () => {
    expect(stageDays({ kind: "dye", hours: 0 })).toBe(2);
    expect(stageDays({ kind: "bleach", hours: 0 })).toBe(1);
    expect(stageDays({ kind: "boil_off", hours: 0 })).toBe(1);
  });
});

describe("scheduleStages", () => {
  it("puts each stage the day after the one before, across a month's end", () => {
    const days = scheduleStages(
      [
        { kind: "dye", hours: 0 },
        { kind: "wax", hours: 15 },
        { kind: "boil_off", hours: 0 },
      ],
      "2026-01-30",
    );
    // Calendar arithmetic checked by hand against a printed 2026 calendar (January has 31 days).
    expect(days).toEqual([
      { plannedStartOn: "2026-01-30", plannedEndOn: "2026-01-31" },
      { plannedStartOn: "2026-02-01", plannedEndOn: "2026-02-03" },
      { plannedStartOn: "2026-02-04", plannedEndOn: "2026-02-04" },
    ]);
  });
  it("knows a leap day (2028 is a leap year, by the Gregorian rule)", () => {
    expect(scheduleStages([{ kind: "dye", hours: 0 }], "2028-02-28")).toEqual([{ plannedStartOn: "2028-02-28", plannedEndOn: "2028-02-29" }]);
  });
});

describe("daysOverlap", () => {
  it("counts a shared first or last day as overlapping", () => {
    expect(daysOverlap("2026-03-01", "2026-03-03", "2026-03-03", "2026-03-05")).toBe(true);
    expect(daysOverlap("2026-03-01", "2026-03-02", "2026-03-03", "2026-03-05")).toBe(false);
    expect(daysOverlap("2026-03-04", "2026-03-04", "2026-03-01", "2026-03-10")).toBe(true);
  });
});

describe("latestTodayIso", () => {
  it("is the calendar day at UTC+14: 10:00 UTC is already the next day there, 09:59 is not", async () => {
    const { latestTodayIso } = await import("@/lib/dates");
    // By hand: 2026-12-02T10:00Z + 14 h = 2026-12-03T00:00 at UTC+14.
    expect(latestTodayIso(new Date("2026-12-02T10:00:00Z"))).toBe("2026-12-03");
    expect(latestTodayIso(new Date("2026-12-02T09:59:59Z"))).toBe("2026-12-02");
  });
});
