import { counts } from './balance';
import type { QuoteRecord } from './types';

// What the customer's page says about refunds, pure: a refund of the deposit and one of a balance payment
// tell different stories (the job cancelled or open again, still booked, owing a balance, or paid in full).
// Null when nothing was refunded, or when the state's own words already say it.

type Story = { title: string; text: string };
type RefundedQuote = Pick<QuoteRecord, 'status' | 'refundedCents' | 'balanceDueCents' | 'payments'>;

export function refundStory(quote: RefundedQuote, money: (cents: number) => string, shopName: string): Story | null {
  if (quote.refundedCents <= 0) return null;
  const refunded = money(quote.refundedCents);
  const taken = quote.payments.filter(counts);
  const balanceRefundedCents = taken
    .filter((p) => p.purpose === 'balance')
    .reduce((sum, p) => sum + p.refundedCents, 0);
  const depositOnly = balanceRefundedCents === 0;
  switch (quote.status) {
    case 'cancelled':
      return {
        title: depositOnly ? 'Deposit refunded — job cancelled' : 'Payments refunded — job cancelled',
        text: `We refunded ${depositOnly ? 'your deposit' : 'what you paid'} of ${refunded}; the job is cancelled and this quote is closed. Call or write to ${shopName} if you would like a new quote.`,
      };
    case 'sent':
    case 'accepted':
      return {
        title: 'Deposit refunded',
        text: `We refunded your earlier deposit of ${refunded}. This quote is open again: you can pay the deposit below when you are ready.`,
      };
    case 'deposit-paid':
      return depositOnly
        ? {
            title: 'Deposit paid, part refunded',
            text: `${refunded} of your deposit was refunded. The job is still booked; we will be in touch about the date.`,
          }
        : {
            title: 'Balance payment refunded',
            text: `We refunded ${money(balanceRefundedCents)} of your balance payment. ${quote.balanceDueCents > 0 ? `${money(quote.balanceDueCents)} is left to pay on the job; we will be in touch about it.` : 'Nothing is left to pay.'}`,
          };
    case 'closed':
      return {
        title: 'Paid in full — thank you',
        text: `The job is done and nothing is left to pay; ${refunded} was refunded to you. Keep this page or its PDF as your record.`,
      };
    default:
      return null;
  }
}
