/** Today's date (UTC) as YYYY-MM-DD: due dates and overdue checks compare calendar days written this way. */
export const todayIso = (): string => new Date().toISOString().slice(0, 10);
