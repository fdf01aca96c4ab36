// The app's date formats, by name, for next-intl (`format.dateTime(at, "moment")`) and for e-mails.
// Times show in the workshop's zone (set once in request.ts); calendar days stored as YYYY-MM-DD
// (due dates, "made on") are dates, not instants, so they are read and shown in UTC and never shift a day.

export const dateTimeFormats = {
  /** A calendar day stored as YYYY-MM-DD: pass `calendarDay(iso)`. */
  day: { dateStyle: "medium", timeZone: "UTC" },
  /** The date of an instant, in the workshop's zone. */
  date: { dateStyle: "medium" },
  /** An instant to the minute, in the workshop's zone. */
  moment: { dateStyle: "medium", timeStyle: "short" },
} as const satisfies Record<string, Intl.DateTimeFormatOptions>;

export type DateTimeFormatName = keyof typeof dateTimeFormats;

/** A YYYY-MM-DD calendar day as the Date the "day" format expects. */
export const calendarDay = (iso: string): Date => new Date(`${iso}T00:00:00Z`);

/**
 * The app's number formats, by name, for next-intl (`format.number(ratio, "percent")`, or `{ratio, number,
 * percent}` in a message) and for e-mails. The language decides the signs: 35,2 % and 1.200 in
 * Indonesian, 35.2% and 1,200 in English.
 */
export const numberFormats = {
  /** A ratio 0–1 as a percentage to one decimal (coverage). */
  percent: { style: "percent", maximumFractionDigits: 1 },
  /** A small ratio as a percentage to two decimals (coverage under 1 %). */
  percentFine: { style: "percent", maximumFractionDigits: 2 },
  /** A count of things. */
  count: { maximumFractionDigits: 0 },
} as const satisfies Record<string, Intl.NumberFormatOptions>;

export type NumberFormatName = keyof typeof numberFormats;
