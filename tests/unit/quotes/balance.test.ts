import {
  balanceDueCents,
  counts,
  invoiceNumber,
  moneyIn,
  receiptNumber,
  type CountablePayment,
} from '@/lib/quotes/balance';

// The balance, worked by hand: a $1,850.00 job with a $370.00 deposit.
const pay = (over: Partial<CountablePayment>): CountablePayment => ({
  purpose: 'deposit',
  status: 'paid',
  amountCents: 37_000,
  refundedCents: 0,
  duplicateOfPaymentId: null,
  ...over,
});

describe('the balance of a quote', () => {
  it('is the total less the deposit paid', () => {
    expect(balanceDueCents(185_000, [pay({})])).toBe(148_000);
  });

  it('leaves out checkouts that were never paid and refunded duplicates', () => {
    const payments = [
      pay({ status: 'pending' }),
      pay({ status: 'expired' }),
      pay({}),
      pay({ id: 9, status: 'refunded', refundedCents: 37_000, duplicateOfPaymentId: 3 } as Partial<CountablePayment>),
    ];
    expect(moneyIn(payments)).toEqual({
      depositsCents: 37_000,
      balancePaidCents: 0,
      refundedCents: 0,
      netPaidCents: 37_000,
    });
    expect(balanceDueCents(185_000, payments)).toBe(148_000);
    expect(counts(payments[3])).toBe(false);
  });

  it('adds back what was refunded: $50.00 of the deposit returned means $50.00 more is due', () => {
    expect(balanceDueCents(185_000, [pay({ status: 'partially-refunded', refundedCents: 5_000 })])).toBe(153_000);
  });

  it('counts balance payments, online or at the counter, and reaches zero when paid in full', () => {
    const part = pay({ purpose: 'balance', amountCents: 100_000 });
    expect(moneyIn([pay({}), part])).toMatchObject({
      depositsCents: 37_000,
      balancePaidCents: 100_000,
      netPaidCents: 137_000,
    });
    expect(balanceDueCents(185_000, [pay({}), part])).toBe(48_000);
    expect(balanceDueCents(185_000, [pay({}), part, pay({ purpose: 'balance', amountCents: 48_000 })])).toBe(0);
  });

  it('never goes below zero', () => {
    expect(balanceDueCents(30_000, [pay({})])).toBe(0);
  });

  it('numbers receipts by quote and payment, the invoice by quote', () => {
    expect(receiptNumber('Q-2026-0042-R2', 17)).toBe('Q-2026-0042-R2-P17');
    expect(invoiceNumber('Q-2026-0042')).toBe('Q-2026-0042-I');
  });
});
