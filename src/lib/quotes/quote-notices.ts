import { createElement } from 'react';
import type { MailShop } from '@/emails/layout';
import { QuoteSentEmail, quoteSentSubject } from '@/emails/quote-sent';
import { RefundNoticeEmail, refundNoticeSubject, type RefundStanding } from '@/emails/refund-notice';
import { renderMail } from '@/emails/render';
import { quoteForNotice, shopSettingsRow } from '@/lib/db/queries/quotes';
import { sendMail, type OutgoingMail } from '@/lib/mail';
import { balanceDueCents, type PaymentPurpose } from './balance';
import type { QuoteRecord, QuoteStatus } from './types';

// The customer's e-mails about a quote, built from the templates in src/emails: from the shop's name,
// replies to the shop's address. Refund notices go after the commit: a refused e-mail is logged and
// never undoes a refund.

export function mailShop(settings: { name: string; email: string; phone: string; address: string } | null): MailShop {
  return {
    name: settings?.name || 'Your shop',
    email: settings?.email || null,
    phone: settings?.phone || null,
    address: settings?.address || null,
  };
}

/** To the customer, from the shop's name, replies to the shop. */
export function envelope(shop: MailShop, to: string): Pick<OutgoingMail, 'to' | 'fromName' | 'replyTo'> {
  return { to, fromName: shop.name, ...(shop.email ? { replyTo: shop.email } : {}) };
}

/** The quote (or revised quote) with its private link; sent inside the send transaction by the caller. */
export async function quoteSentMail(
  record: QuoteRecord,
  shop: MailShop,
  link: string,
  replaces: string | null,
): Promise<OutgoingMail> {
  const props = {
    shop,
    customerName: record.customer.name,
    number: record.number,
    vehicleLabel: record.build?.vehicleLabel ?? null,
    totalCents: record.totalCents,
    depositCents: record.depositCents,
    validUntil: record.validUntil,
    link,
    replaces,
  };
  return {
    ...envelope(shop, record.customer.email ?? ''),
    ...(await renderMail(quoteSentSubject(props), createElement(QuoteSentEmail, props))),
  };
}

/**
 * The refund notice: what was refunded (deposit or balance payment) and where the quote stands now. Sent
 * after the commit; it carries no link: only the token's hash is kept.
 */
export async function sendRefundNotice(
  quoteId: number,
  refund: { amountCents: number; purpose: PaymentPurpose; atCounter?: boolean },
): Promise<void> {
  try {
    const [{ quote, customer, payments }, settings] = await Promise.all([quoteForNotice(quoteId), shopSettingsRow()]);
    if (!quote || !customer?.email) return;
    const shop = mailShop(settings);
    const props = {
      shop,
      customerName: customer.name,
      number: quote.number,
      refundedCents: refund.amountCents,
      purpose: refund.purpose,
      atCounter: refund.atCounter ?? false,
      standing: refundStanding(quote.status),
      balanceDueCents: balanceDueCents(quote.totalCents, payments),
    };
    await sendMail({
      ...envelope(shop, customer.email),
      ...(await renderMail(refundNoticeSubject(props), createElement(RefundNoticeEmail, props))),
    });
  } catch (error) {
    console.error(`[refunds] the refund notice for quote ${quoteId} was not sent`, error);
  }
}

/** The quote's state after a refund, as the notice tells it. */
function refundStanding(status: QuoteStatus): RefundStanding {
  if (status === 'cancelled') return 'cancelled';
  if (status === 'sent' || status === 'accepted') return 'reopened';
  if (status === 'closed') return 'paid-in-full';
  return 'booked';
}
