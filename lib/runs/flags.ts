import { FLAG_FINDINGS, FLAG_WINDOW_DAYS, READING_FUME_ABOVE_C } from "./limits";
import type { FindingKind } from "./schema";

export interface FindingForFlag {
  stampId: string | null;
  kind: FindingKind;
  /** YYYY-MM-DD */
  foundOn: string;
}

export interface StampFlag {
  stampId: string;
  kind: FindingKind;
  /** Findings of that kind within the window ending on the latest of them. */
  findings: number;
  firstOn: string;
  lastOn: string;
}

const dayNumber = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / 86_400_000;

/**
 * Stamps that keep causing the same finding: at least 3 findings of one kind naming one stamp whose dates lie
 * within 30 days of each other (any window of 30 days: the last minus the first ≤ 29 days, both days counted).
 * Common practice (the workshop's rule, not a published figure). With `today`, only windows ending within the
 * last 30 days count, so an old run of findings stops flagging once the stamp has been fine for a month.
 * Each finding counts once, whatever its `count` (a finding is one occasion).
 */
export function flaggedStamps(findings: readonly FindingForFlag[], today?: string, threshold = FLAG_FINDINGS, windowDays = FLAG_WINDOW_DAYS): StampFlag[] {
  const groups = new Map<string, FindingForFlag[]>();
  for (const f of findings) {
    if (!f.stampId) continue;
    const key = `${f.stampId} ${f.kind}`;
    groups.set(key, [...(groups.get(key) ?? []), f]);
  }
  const flags: StampFlag[] = [];
  for (const group of groups.values()) {
    const days = group.map((f) => f.foundOn).sort();
    let best: StampFlag | null = null;
    let start = 0;
    for (let end = 0; end < days.length; end++) {
      while (dayNumber(days[end]) - dayNumber(days[start]) > windowDays - 1) start++;
      const n = end - start + 1;
      const recent = today === undefined || dayNumber(today) - dayNumber(days[end]) <= windowDays - 1;
      if (n >= threshold && recent && (!best || n >= best.findings)) {
        best = { stampId: group[0].stampId!, kind: group[0].kind, findings: n, firstOn: days[start], lastOn: days[end] };
      }
    }
    if (best) flags.push(best);
  }
  return flags.sort((a, b) => b.findings - a.findings || a.stampId.localeCompare(b.stampId));
}

export type ReadingWarning = "aboveRange" | "fumes";

/**
 * The cautions a pot reading calls for at once: above the recipe's working range, and above 100 °C (fumes rise
 * quickly, SPEC 5.3). Both can apply. Below the range is no hazard and not warned here.
 */
export function readingWarnings(tempC: number, range: { minC: number; maxC: number } | null): ReadingWarning[] {
  const warnings: ReadingWarning[] = [];
  if (range && tempC > range.maxC) warnings.push("aboveRange");
  if (tempC > READING_FUME_ABOVE_C) warnings.push("fumes");
  return warnings;
}
