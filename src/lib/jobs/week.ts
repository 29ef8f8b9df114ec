// Calendar arithmetic on YYYY-MM-DD strings, done at noon UTC so no time zone or clock change moves a day.
const DAY_MS = 86_400_000;
const at = (date: string) => Date.parse(`${date}T12:00:00Z`);
const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);

export function addDays(date: string, days: number): string {
  return iso(at(date) + days * DAY_MS);
}

/** The Monday on or before the date: the shop's week starts on Monday. */
export function mondayOf(date: string): string {
  const weekday = new Date(at(date)).getUTCDay(); // 0 Sunday … 6 Saturday
  return addDays(date, -((weekday + 6) % 7));
}

export function weekDays(monday: string): string[] {
  return Array.from({ length: 7 }, (_, i) => addDays(monday, i));
}
