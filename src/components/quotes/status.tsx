import { StateTag } from '@/components/ui/state-tag';
import { stateWord } from '@/lib/quotes/lifecycle';

// Quote and payment states, always as a word (the colour only repeats it).
const QUOTE_TONE: Record<string, 'ok' | 'caution' | 'fault' | 'muted'> = {
  draft: 'muted',
  sent: 'caution',
  accepted: 'caution',
  'deposit-paid': 'ok',
  closed: 'ok',
  declined: 'fault',
  expired: 'fault',
  cancelled: 'fault',
  replaced: 'muted',
};
const PAYMENT_TONE: Record<string, 'ok' | 'caution' | 'fault' | 'muted'> = {
  pending: 'caution',
  paid: 'ok',
  failed: 'fault',
  expired: 'muted',
  refunded: 'muted',
  'partially-refunded': 'caution',
};
const PAYMENT_WORD: Record<string, string> = {
  pending: 'Checkout started',
  paid: 'Paid',
  failed: 'Failed',
  expired: 'Checkout expired',
  refunded: 'Refunded',
  'partially-refunded': 'Partly refunded',
};

/** The word for a quote state, as every screen says it. */
export function quoteStatusWord(status: string): string {
  return stateWord(status);
}

export function QuoteStatusTag({ status }: { status: string }) {
  return <StateTag tone={QUOTE_TONE[status] ?? 'muted'}>{stateWord(status)}</StateTag>;
}

export function PaymentStatusTag({ status }: { status: string | null }) {
  if (!status) return <StateTag tone="muted">No payment</StateTag>;
  return <StateTag tone={PAYMENT_TONE[status] ?? 'muted'}>{PAYMENT_WORD[status] ?? status}</StateTag>;
}
