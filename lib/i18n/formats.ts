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
