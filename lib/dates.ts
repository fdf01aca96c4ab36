/** Today's date (UTC) as YYYY-MM-DD: due dates and overdue checks compare calendar days written this way. */
export const todayIso = (): string => new Date().toISOString().slice(0, 10);

/**
 * Today where the calendar is furthest ahead (UTC+14, the Line Islands: the IANA zone Pacific/Kiritimati, from
 * memory) as YYYY-MM-DD. An input schema cannot know the workshop's zone, so it refuses only days that are future
 * everywhere; where the day matters (a wax use) the data layer holds it against the workshop's own today.
 */
export const latestTodayIso = (now = new Date()): string => new Date(now.getTime() + 14 * 3_600_000).toISOString().slice(0, 10);
