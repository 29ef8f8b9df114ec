// The quote lifecycle, pure (no database, React or Next): the states in our own words and every legal
// move between them. Each move names who may make it: staff through POST /api/quotes/[id]/transition, or
// the app itself as the result of something else (sending, a payment, a refund, a revision), so the
// transition route cannot fake a payment or skip the e-mail that sending is.

/** Every state a quote can be in (the database enum follows this list; see the lifecycle migration). */
export const QUOTE_STATE_LIST = [
  'draft',
  'sent',
  'accepted',
  'deposit-paid',
  'closed',
  'declined',
  'expired',
  'cancelled',
  'replaced',
] as const;
export type QuoteStatus = (typeof QUOTE_STATE_LIST)[number];

/** 'staff': the transition route. 'send' | 'payment' | 'refund' | 'revise': only the flow that does it. */
export type TransitionVia = 'staff' | 'send' | 'payment' | 'refund' | 'revise';

type Edge = { from: QuoteStatus; to: QuoteStatus; via: TransitionVia; why: string };

const OPEN: readonly QuoteStatus[] = ['sent', 'accepted'];

const EDGES: readonly Edge[] = [
  { from: 'draft', to: 'sent', via: 'send', why: 'e-mailed to the customer' },
  { from: 'sent', to: 'sent', via: 'send', why: 'sent again with a new link' },
  { from: 'sent', to: 'accepted', via: 'staff', why: 'the customer accepted in person or by phone' },
  ...OPEN.map((from): Edge => ({ from, to: 'deposit-paid', via: 'payment', why: 'the deposit arrived' })),
  // Closing is the balance being paid in full (online or at the counter). Staff may close by hand only a
  // job with nothing left to pay; the transition route checks the balance (quote-lifecycle.ts).
  { from: 'deposit-paid', to: 'closed', via: 'payment', why: 'the balance was paid in full' },
  { from: 'deposit-paid', to: 'closed', via: 'staff', why: 'the job is done and nothing is left to pay' },
  ...OPEN.map((from): Edge => ({ from, to: 'declined', via: 'staff', why: 'the customer said no' })),
  ...OPEN.map((from): Edge => ({ from, to: 'expired', via: 'staff', why: 'past its valid-until day' })),
  ...(['draft', ...OPEN] as QuoteStatus[]).map((from): Edge => ({
    from,
    to: 'cancelled',
    via: 'staff',
    why: 'withdrawn by the shop',
  })),
  // A paid job ends only through the refund of its deposit: money held is never silently dropped.
  ...(['deposit-paid', 'accepted'] as QuoteStatus[]).map((from): Edge => ({
    from,
    to: 'cancelled',
    via: 'refund',
    why: 'deposit refunded, job cancelled',
  })),
  ...(['deposit-paid', 'accepted'] as QuoteStatus[]).map((from): Edge => ({
    from,
    to: 'sent',
    via: 'refund',
    why: 'deposit refunded, quote open again',
  })),
  // A refund of money on a closed job (a balance payment, or what is left of the deposit) leaves part of the
  // job unpaid again: it goes back to the open job with a balance due, never to a silent "paid in full".
  { from: 'closed', to: 'deposit-paid', via: 'refund', why: 'money refunded, the balance is due again' },
  ...(['sent', 'accepted', 'expired', 'declined'] as QuoteStatus[]).map((from): Edge => ({
    from,
    to: 'replaced',
    via: 'revise',
    why: 'a newer revision replaces it',
  })),
];

/** What each state is called on every screen, document and e-mail. */
export const STATE_WORDS: Record<QuoteStatus, string> = {
  draft: 'Draft',
  sent: 'Sent',
  accepted: 'Accepted, unpaid',
  'deposit-paid': 'Deposit paid',
  closed: 'Balance paid, closed',
  declined: 'Declined',
  expired: 'Expired',
  cancelled: 'Cancelled',
  replaced: 'Replaced by a newer quote',
};

/** The word for a state, for values typed loosely (database rows, query strings). */
export function stateWord(status: string): string {
  return STATE_WORDS[status as QuoteStatus] ?? status;
}

export function canTransition(from: QuoteStatus, to: QuoteStatus, via: TransitionVia): boolean {
  return EDGES.some((e) => e.from === from && e.to === to && e.via === via);
}

/** The states staff may move a quote to from here through the transition route. */
export function staffMoves(from: QuoteStatus): QuoteStatus[] {
  return EDGES.filter((e) => e.from === from && e.via === 'staff').map((e) => e.to);
}

/** Why a move is refused, in words: either it exists but belongs to another flow, or it does not exist. */
export function refusalMessage(from: QuoteStatus, to: QuoteStatus, via: TransitionVia): string {
  const other = EDGES.find((e) => e.from === from && e.to === to && e.via !== via);
  if (other) {
    const how: Record<TransitionVia, string> = {
      staff: 'the transition route',
      send: 'sending the quote (POST /api/quotes/[id]/send)',
      payment: 'the customer paying the deposit',
      refund: 'a refund (POST /api/quotes/[id]/refund)',
      revise: 'revising the quote (POST /api/quotes/[id]/revise)',
    };
    return `A quote goes from ${STATE_WORDS[from].toLowerCase()} to ${STATE_WORDS[to].toLowerCase()} only by ${how[other.via]}.`;
  }
  const allowed = staffMoves(from);
  const next = allowed.length
    ? ` From here staff may move it to: ${allowed.map((s) => STATE_WORDS[s].toLowerCase()).join(', ')}.`
    : ' Nothing more can happen to it.';
  return `A quote that is ${STATE_WORDS[from].toLowerCase()} cannot become ${STATE_WORDS[to].toLowerCase()}.${next}`;
}

/** States a customer can still act on (pay, accept): open and not yet paid. */
export function isOpen(status: QuoteStatus): boolean {
  return OPEN.includes(status);
}

/** States from which staff may make a revision (nothing paid: a paid job is refunded first). */
export function canRevise(status: QuoteStatus): boolean {
  return canTransition(status, 'replaced', 'revise');
}

/** Q-2026-0101 → Q-2026-0101-R2; Q-2026-0101-R2 → Q-2026-0101-R3. */
export function revisionNumber(number: string, revision: number): string {
  return `${number.replace(/-R\d+$/, '')}-R${revision}`;
}

/** How long a quote stays good when staff send it without a date (common practice; the shop may edit it). */
export const DEFAULT_VALID_DAYS = 30;

export function validUntilFrom(now: Date, days = DEFAULT_VALID_DAYS): string {
  return new Date(now.getTime() + days * 86_400_000).toISOString().slice(0, 10);
}
