import { Op, type Transaction } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import { sendMail } from '@/lib/mail';
import { refundEmail } from '@/lib/quotes/refund-email';
import { Customer, Payment, Quote, ShopSettings } from '../models';

// What a full refund of the deposit does to the quote, so no page keeps saying "Deposit paid": the job
// is cancelled (the default) or the quote reopened for a new payment, as the manager chooses.

export type AfterFullRefund = 'cancel' | 'reopen';

/**
 * Called with the quote row locked, after a payment's refunded amount changed. When no deposit is held
 * any more, a paid quote becomes cancelled or sent again. Returns true when it changed the quote.
 */
export async function settleFullRefund(quote: Quote, after: AfterFullRefund, actor: { user?: { id: number; email: string }; actor?: string }, t: Transaction): Promise<boolean> {
  if (quote.status !== 'deposit-paid' && quote.status !== 'accepted') return false;
  const held = await Payment.count({ where: { quoteId: quote.id, status: { [Op.in]: ['paid', 'partially-refunded'] }, duplicateOfPaymentId: null }, transaction: t });
  if (held > 0) return false;
  const to = after === 'reopen' ? 'sent' : 'cancelled';
  const from = quote.status;
  quote.set({ status: to });
  await quote.save({ transaction: t });
  await recordAudit({ ...actor, action: 'quote.deposit-refunded', entityType: 'quote', entityId: quote.id, before: { status: from }, after: { status: to } }, t);
  return true;
}

/**
 * The customer's refund notice, after the commit: a refused e-mail never undoes a refund, it is logged.
 * It carries no link: only the hash of the customer's token is stored, and the earlier e-mail has it.
 */
export async function sendRefundNotice(quoteId: number): Promise<void> {
  try {
    const quote = await Quote.findByPk(quoteId, { include: [{ model: Customer, as: 'customer', attributes: ['name', 'email'] }, { model: Payment, as: 'payments' }] });
    const customer = (quote as (Quote & { customer?: Customer }) | null)?.customer;
    if (!quote || !customer?.email) return;
    const pays = ((quote as Quote & { payments?: Payment[] }).payments ?? []).filter((p) => !p.duplicateOfPaymentId);
    const refundedCents = pays.reduce((s, p) => s + p.refundedCents, 0);
    const settings = await ShopSettings.findOne({ order: [['id', 'ASC']] });
    const shopName = settings?.name ?? 'Your shop';
    const mail = refundEmail({ refund: { number: quote.number, customer: { name: customer.name }, refundedCents, reopened: quote.status === 'sent' }, shopName });
    await sendMail({ to: customer.email, ...(settings?.email ? { replyTo: settings.email } : {}), ...mail });
  } catch (error) {
    console.error(`[refunds] the refund notice for quote ${quoteId} was not sent`, error);
  }
}
