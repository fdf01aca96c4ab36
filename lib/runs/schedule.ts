import type { StageKind } from "./schema";

/**
 * Stamper hours in one working day at a stamping table. Common practice: a day of about seven hours' stamping
 * (a working day of eight with the pot heating and the breaks).
 */
export const STAMPER_HOURS_PER_DAY = 7;

/**
 * Calendar days a stage takes when nobody has planned it: a dye bath one day and a day to dry (common practice:
 * cloth dries overnight and is waxed again the next day), a bleaching one day, the boil-off one day. A waxing takes
 * its stamper hours over the stampers at the table, at least a day.
 */
export const STAGE_DAYS: Record<Exclude<StageKind, "wax">, number> = { dye: 2, bleach: 1, boil_off: 1 };

export interface StageToSchedule {
  kind: StageKind;
  /** Stamper hours estimated (waxing stages). */
  hours: number;
}

export interface ScheduledDays {
  plannedStartOn: string;
  plannedEndOn: string;
}

const addDays = (iso: string, days: number) => {
  const d = new Date(`${iso}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
};

/** The days one stage takes: a waxing its hours over `stampers` stampers of seven hours a day, the rest a fixed count. */
export function stageDays(stage: StageToSchedule, stampers = 1): number {
  if (stage.kind !== "wax") return STAGE_DAYS[stage.kind];
  const perDay = STAMPER_HOURS_PER_DAY * Math.max(1, Math.floor(stampers));
  return Math.max(1, Math.ceil(stage.hours / perDay - 1e-9));
}

/**
 * Planned days for stages in their order of work from `startOn` (YYYY-MM-DD, calendar days): each stage starts the
 * day after the one before ends. The run's dates when nobody has planned them yet.
 */
export function scheduleStages(stages: readonly StageToSchedule[], startOn: string, stampers = 1): ScheduledDays[] {
  let next = startOn;
  return stages.map((s) => {
    const days = stageDays(s, stampers);
    const planned = { plannedStartOn: next, plannedEndOn: addDays(next, days - 1) };
    next = addDays(next, days);
    return planned;
  });
}

/** True when the day ranges [aFrom, aUntil] and [bFrom, bUntil] share a day (YYYY-MM-DD compares as text). */
export function daysOverlap(aFrom: string, aUntil: string, bFrom: string, bUntil: string): boolean {
  return aFrom <= bUntil && bFrom <= aUntil;
}
