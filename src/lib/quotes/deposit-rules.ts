// Pure rules for taking a deposit exactly once (no database, React or Next): when a quote may be paid,
// whether a completed checkout is the one we asked for, and which database errors are worth a retry.

/** Today's date in UTC as YYYY-MM-DD, the form valid-until dates are stored in. */
export function todayUtc(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** A quote is good through the whole of its valid-until day (UTC); no date means no limit. */
export function isPastValidUntil(validUntil: string | null, now: Date = new Date()): boolean {
  return validUntil !== null && validUntil < todayUtc(now);
}

export type AskedFor = { quoteId: number; amountCents: number; currency: string };
export type CompletedSession = {
  amount_total: number | null;
  currency: string | null;
  metadata: Record<string, string> | null;
  client_reference_id: string | null;
};

/**
 * What is wrong with a completed checkout compared with what the shop asked for: the quote it names and
 * the amount and currency it charged. A signed event is still only trusted when it matches our own record.
 */
export function sessionMismatches(session: CompletedSession, asked: AskedFor): string[] {
  const problems: string[] = [];
  const quote = String(asked.quoteId);
  if (session.metadata?.quoteId !== quote)
    problems.push(`the session names quote ${session.metadata?.quoteId ?? 'none'}, not quote ${quote}`);
  if (session.client_reference_id !== null && session.client_reference_id !== quote)
    problems.push(`the session's reference is ${session.client_reference_id}, not quote ${quote}`);
  if (session.amount_total !== asked.amountCents)
    problems.push(
      `the session charged ${session.amount_total ?? 'nothing'} cents, the deposit asked for was ${asked.amountCents}`,
    );
  if ((session.currency ?? '').toLowerCase() !== asked.currency.toLowerCase())
    problems.push(`the session is in ${session.currency ?? 'no currency'}, not ${asked.currency}`);
  return problems;
}

/** A YYYY-MM-DD day plus n whole days (UTC). */
export function addDaysUtc(day: string, n: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
}
