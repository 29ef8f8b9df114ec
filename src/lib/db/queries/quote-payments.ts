import 'server-only';
import { Op, type Transaction } from 'sequelize';
import type { PaymentMethod, PaymentPurpose } from '@/lib/quotes/balance';
import { Payment } from '../models';

// A quote's payments in the database: the rows checkouts, payment events, counter payments and refunds
// lock and write. Callers lock the quote row first (lockQuote in ./quotes) and its payments second, so
// concurrent paths queue instead of deadlocking. SQL only: the payments service is called from src/lib/quotes/.

export type PaymentStatus = Payment['status'];

/** Paid and not (wholly) given back. */
export const HELD: readonly PaymentStatus[] = ['paid', 'partially-refunded'];

/** A quote's payments, oldest first, locked (optionally all but one). */
export function lockPayments(quoteId: number, t: Transaction, options: { except?: number } = {}): Promise<Payment[]> {
  return Payment.findAll({
    where: { quoteId, ...(options.except !== undefined ? { id: { [Op.ne]: options.except } } : {}) },
    order: [['id', 'ASC']],
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
}

/** A quote's payments, read in the caller's transaction without a further lock. */
export function paymentsOf(quoteId: number, t: Transaction): Promise<Payment[]> {
  return Payment.findAll({ where: { quoteId }, order: [['id', 'ASC']], transaction: t });
}

/** Reads a locked payment row again in the transaction, to see what another writer (the webhook) left on it. */
export async function rereadPayment(payment: Payment, t: Transaction): Promise<void> {
  await payment.reload({ transaction: t, lock: t.LOCK.UPDATE });
}

/** One payment row, locked. */
export function lockPayment(id: number, t: Transaction): Promise<Payment | null> {
  return Payment.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
}

/**
 * The payment row for a checkout session the app opened, unlocked: a locking read of a row that is not
 * there takes a gap lock, and concurrent inserts into that gap deadlock.
 */
export function paymentForSession(sessionId: string): Promise<Pick<Payment, 'id' | 'quoteId'> | null> {
  return Payment.findOne({ where: { providerSessionId: sessionId }, attributes: ['id', 'quoteId'] });
}

/** The payment row the provider's payment (intent) id belongs to, unlocked. */
export function paymentForProviderPayment(intent: string): Promise<Pick<Payment, 'id' | 'quoteId'> | null> {
  return Payment.findOne({ where: { providerPaymentId: intent }, attributes: ['id', 'quoteId'] });
}

/**
 * The payment a manager refunds, locked: the one named (deposit or balance, online or at the counter), else
 * the latest deposit. Only money still held counts (paid or partly refunded, never a duplicate given back).
 */
export function lockRefundablePayment(
  quoteId: number,
  paymentId: number | undefined,
  t: Transaction,
): Promise<Payment | null> {
  return Payment.findOne({
    where: {
      quoteId,
      ...(paymentId !== undefined ? { id: paymentId } : { purpose: 'deposit' }),
      status: { [Op.in]: [...HELD] },
      duplicateOfPaymentId: null,
    },
    order: [['id', 'DESC']],
    transaction: t,
    lock: t.LOCK.UPDATE,
  });
}

/** A checkout session just opened with the provider, waiting for its money. */
export async function insertPendingCheckout(
  row: { quoteId: number; sessionId: string; amountCents: number; currency: string; purpose: PaymentPurpose },
  t: Transaction,
): Promise<void> {
  await Payment.create(
    {
      quoteId: row.quoteId,
      providerSessionId: row.sessionId,
      providerPaymentId: null,
      amountCents: row.amountCents,
      currency: row.currency,
      status: 'pending',
      paidAt: null,
      ...(row.purpose === 'balance' ? { purpose: 'balance' as const, method: 'online' as const } : {}),
    },
    { transaction: t },
  );
}

/** Money taken at the counter, paid at once, with who took it. */
export function insertCounterPayment(
  row: {
    quoteId: number;
    amountCents: number;
    currency: string;
    method: Exclude<PaymentMethod, 'online'>;
    userId: number;
  },
  t: Transaction,
): Promise<Payment> {
  return Payment.create(
    {
      quoteId: row.quoteId,
      provider: 'counter',
      providerSessionId: null,
      providerPaymentId: null,
      amountCents: row.amountCents,
      currency: row.currency,
      status: 'paid',
      paidAt: new Date(),
      purpose: 'balance',
      method: row.method,
      recordedByUserId: row.userId,
    },
    { transaction: t },
  );
}

export async function markExpired(payment: Payment, t: Transaction): Promise<void> {
  payment.set({ status: 'expired' });
  await payment.save({ transaction: t });
}

export async function markPaid(payment: Payment, intent: string, t: Transaction): Promise<void> {
  payment.set({ status: 'paid', paidAt: new Date(), providerPaymentId: intent });
  await payment.save({ transaction: t });
}

/** Money that arrived and went straight back (a duplicate, or for a quote that could not take it): kept, never counted. */
export async function markGivenBack(
  payment: Payment,
  intent: string,
  duplicateOfPaymentId: number | null,
  t: Transaction,
): Promise<void> {
  payment.set({
    status: 'refunded',
    refundedCents: payment.amountCents,
    paidAt: new Date(),
    providerPaymentId: intent,
    duplicateOfPaymentId,
  });
  await payment.save({ transaction: t });
}

/** The running refunded total (never above the amount); the status follows it. */
export async function setRefundedCents(payment: Payment, refundedCents: number, t: Transaction): Promise<void> {
  payment.set({ refundedCents, status: refundedCents >= payment.amountCents ? 'refunded' : 'partially-refunded' });
  await payment.save({ transaction: t });
}
