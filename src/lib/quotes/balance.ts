// The balance of a quote, pure (no database, React or Next): what was paid, what was given back, what is
// still due. Integer cents. A refunded duplicate (a second checkout refunded at once) took the money and
// gave it back, so it never counts; a refund lowers what the customer has paid, so the balance due is
// total − (deposits + balance payments − refunds), never below zero.

export type PaymentPurpose = 'deposit' | 'balance';
export type PaymentMethod = 'online' | 'cash' | 'card-present';

export type CountablePayment = {
  purpose: PaymentPurpose;
  status: string;
  amountCents: number;
  refundedCents: number;
  duplicateOfPaymentId: number | null;
};

const MONEY_TAKEN = ['paid', 'partially-refunded', 'refunded'];

/** A payment whose money the shop took (and may have given back in part or in full). */
export function counts(p: CountablePayment): boolean {
  return MONEY_TAKEN.includes(p.status) && !p.duplicateOfPaymentId;
}

export type MoneyIn = { depositsCents: number; balancePaidCents: number; refundedCents: number; netPaidCents: number };

export function moneyIn(payments: readonly CountablePayment[]): MoneyIn {
  let depositsCents = 0;
  let balancePaidCents = 0;
  let refundedCents = 0;
  for (const p of payments.filter(counts)) {
    if (p.purpose === 'balance') balancePaidCents += p.amountCents;
    else depositsCents += p.amountCents;
    refundedCents += p.refundedCents;
  }
  return {
    depositsCents,
    balancePaidCents,
    refundedCents,
    netPaidCents: depositsCents + balancePaidCents - refundedCents,
  };
}

/** What the customer still owes on a quote of totalCents. */
export function balanceDueCents(totalCents: number, payments: readonly CountablePayment[]): number {
  return Math.max(0, totalCents - moneyIn(payments).netPaidCents);
}

/** The words for how a payment was made, on every page, receipt and e-mail. */
export const METHOD_WORDS: Record<PaymentMethod, string> = {
  online: 'Paid online by card',
  cash: 'Cash at the counter',
  'card-present': 'Card at the counter',
};

export const PURPOSE_WORDS: Record<PaymentPurpose, string> = { deposit: 'Deposit', balance: 'Balance' };

/** A receipt's number: the quote's number and the payment's own id, so it is unique and traceable. */
export function receiptNumber(quoteNumber: string, paymentId: number): string {
  return `${quoteNumber}-P${paymentId}`;
}

/** The final invoice carries the quote's number with an I, one invoice per quote. */
export function invoiceNumber(quoteNumber: string): string {
  return `${quoteNumber}-I`;
}
