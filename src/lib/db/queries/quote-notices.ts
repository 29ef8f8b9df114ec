import { createElement } from 'react';
import type { MailShop } from '@/emails/layout';
import { QuoteSentEmail, quoteSentSubject } from '@/emails/quote-sent';
import { RefundNoticeEmail, refundNoticeSubject } from '@/emails/refund-notice';
import { renderMail } from '@/emails/render';
import { sendMail, type OutgoingMail } from '@/lib/mail';
import { Customer, Payment, Quote, ShopSettings } from '../models';
import type { QuoteRecord } from './quotes';

// The customer's e-mails about a quote, built from the templates in src/emails: from the shop's name,
// replies to the shop's address. Receipts and refund notices go after the commit: a refused e-mail is
// logged and never undoes a payment or a refund.

export function mailShop(settings: Pick<ShopSettings, 'name' | 'email' | 'phone' | 'address'> | null): MailShop {
  return { name: settings?.name || 'Your shop', email: settings?.email || null, phone: settings?.phone || null, address: settings?.address || null };
}

function envelope(shop: MailShop, to: string): Pick<OutgoingMail, 'to' | 'fromName' | 'replyTo'> {
  return { to, fromName: shop.name, ...(shop.email ? { replyTo: shop.email } : {}) };
}

/** The quote (or revised quote) with its private link; sent inside the send transaction by the caller. */
export async function quoteSentMail(record: QuoteRecord, shop: MailShop, link: string, replaces: string | null): Promise<OutgoingMail> {
  const props = {
    shop, customerName: record.customer.name, number: record.number, vehicleLabel: record.build?.vehicleLabel ?? null, totalCents: record.totalCents,
    depositCents: record.depositCents, validUntil: record.validUntil, link, replaces,
  };
  return { ...envelope(shop, record.customer.email ?? ''), ...(await renderMail(quoteSentSubject(props), createElement(QuoteSentEmail, props))) };
}

async function quoteWithCustomer(quoteId: number) {
  const quote = (await Quote.findByPk(quoteId, { include: [{ model: Customer, as: 'customer', attributes: ['name', 'email'] }, { model: Payment, as: 'payments' }] })) as
    | (Quote & { customer?: Customer; payments?: Payment[] })
    | null;
  const settings = await ShopSettings.findOne({ order: [['id', 'ASC']] });
  return { quote, customer: quote?.customer, payments: (quote?.payments ?? []).filter((p) => !p.duplicateOfPaymentId), shop: mailShop(settings) };
}

/** The refund notice after the deposit was refunded in full. It carries no link: only the token's hash is kept. */
export async function sendRefundNotice(quoteId: number): Promise<void> {
  try {
    const { quote, customer, payments, shop } = await quoteWithCustomer(quoteId);
    if (!quote || !customer?.email) return;
    const props = { shop, customerName: customer.name, number: quote.number, refundedCents: payments.reduce((s, p) => s + p.refundedCents, 0), reopened: quote.status === 'sent' };
    await sendMail({ ...envelope(shop, customer.email), ...(await renderMail(refundNoticeSubject(props), createElement(RefundNoticeEmail, props))) });
  } catch (error) {
    console.error(`[refunds] the refund notice for quote ${quoteId} was not sent`, error);
  }
}
