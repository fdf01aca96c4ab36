/** Time-zone helpers on the platform's Intl (IANA names such as Asia/Jakarta). Pure. */

/** Whether the runtime knows `name` as a time zone (IANA names and aliases such as UTC). */
export function isTimeZone(name: string): boolean {
  if (!name || name.length > 64) return false;
  try {
    new Intl.DateTimeFormat("en", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

/** The calendar date at `at` in `timeZone`, as YYYY-MM-DD (what "today" means to the workshop). */
export function isoDateIn(timeZone: string, at: Date = new Date()): string {
  const parts = new Intl.DateTimeFormat("en-CA", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).formatToParts(at);
  const part = (type: string) => parts.find((p) => p.type === type)!.value;
  return `${part("year")}-${part("month")}-${part("day")}`;
}

/** Every time zone the runtime lists, for pickers. */
export function timeZoneNames(): string[] {
  const listed = typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return listed.includes("UTC") ? listed : [...listed, "UTC"];
}
