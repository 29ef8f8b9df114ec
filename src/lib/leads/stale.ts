// A lead goes cold when nobody acts on it: still "new, not contacted", and neither its arrival nor any
// note on it (a call, a message left) is more recent than the shop's limit in days. Pure: the caller
// passes "now", so the rule is tested with fixed dates and the page uses the server's clock.

const DAY_MS = 86_400_000;

export type LeadForStaleness = { status: string; createdAt: string | Date };

/** The last time anyone touched the lead: its arrival or its newest note. */
export function lastTouch(lead: LeadForStaleness, noteTimes: readonly (string | Date)[]): Date {
  return new Date(Math.max(new Date(lead.createdAt).getTime(), ...noteTimes.map((t) => new Date(t).getTime())));
}

/** Whole days the lead has waited without contact when it is stale (at least `staleDays`), else null. */
export function staleDays(
  lead: LeadForStaleness,
  noteTimes: readonly (string | Date)[],
  now: Date,
  limitDays: number,
): number | null {
  if (lead.status !== 'new') return null;
  const waited = Math.floor((now.getTime() - lastTouch(lead, noteTimes).getTime()) / DAY_MS);
  return waited >= limitDays ? waited : null;
}

/** The moment before which an untouched new lead counts as stale. */
export function staleCutoff(now: Date, limitDays: number): Date {
  return new Date(now.getTime() - limitDays * DAY_MS);
}
