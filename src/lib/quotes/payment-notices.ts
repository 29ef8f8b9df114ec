import { createElement } from 'react';
import { BalanceDueEmail, balanceDueSubject } from '@/emails/balance-due';
import { BalanceReceiptEmail, balanceReceiptSubject } from '@/emails/balance-receipt';
import { DepositReceiptEmail, depositReceiptSubject } from '@/emails/deposit-receipt';
import { renderMail } from '@/emails/render';
import { sendMail, type MailAttachment, type OutgoingMail } from '@/lib/mail';
import { invoiceNumber, receiptNumber } from './balance';
import { invoicePdf, receiptPdf } from './payment-pdf';
import { getQuote, shopForDocuments, shopSettingsRow } from '@/lib/db/queries/quotes';
import { envelope, mailShop } from './quote-notices';
import type { QuoteRecord } from './types';

// The customer's e-mails about money after the deposit: the pay-the-balance request and the receipt of
// every payment, with the receipt PDF attached and, once the job is paid in full, the final invoice.
// Receipts go after the commit: a refused e-mail is logged and never undoes a payment.

/** The balance request, sent by the caller inside its transaction (a refused e-mail changes nothing). */
export async function balanceDueMail(
  record: QuoteRecord,
  settings: Parameters<typeof mailShop>[0],
  link: string,
): Promise<OutgoingMail> {
  const shop = mailShop(settings);
  const props = {
    shop,
    customerName: record.customer.name,
    number: record.number,
    vehicleLabel: record.build?.vehicleLabel ?? null,
    totalCents: record.totalCents,
    paidCents: record.paidCents - record.refundedCents,
    balanceCents: record.balanceDueCents,
    link,
  };
  return {
    ...envelope(shop, record.customer.email ?? ''),
    ...(await renderMail(balanceDueSubject(props), createElement(BalanceDueEmail, props))),
  };
}

/** The PDFs that go with a payment's receipt: its receipt, and the final invoice once nothing is left to pay. */
export async function paymentDocuments(record: QuoteRecord, paymentId: number): Promise<MailAttachment[]> {
  const shop = await shopForDocuments();
  if (!shop) return [];
  const files: MailAttachment[] = [
    {
      filename: `receipt-${receiptNumber(record.number, paymentId)}.pdf`,
      content: await receiptPdf(record, paymentId, shop),
    },
  ];
  if (record.status === 'closed' && record.balanceDueCents === 0)
    files.push({ filename: `invoice-${invoiceNumber(record.number)}.pdf`, content: await invoicePdf(record, shop) });
  return files;
}

/** The receipt for a payment that has just been recorded (a deposit, or towards the balance). */
export async function sendPaymentReceipt(quoteId: number, paymentId: number): Promise<void> {
  try {
    const record = await getQuote(quoteId);
    const payment = record?.payments.find((p) => p.id === paymentId);
    if (!record?.customer.email || !payment) return;
    const shop = mailShop(await shopSettingsRow());
    const paidAt = payment.paidAt ?? new Date().toISOString();
    const rendered =
      payment.purpose === 'deposit'
        ? await (async () => {
            const props = {
              shop,
              customerName: record.customer.name,
              number: record.number,
              amountCents: payment.amountCents,
              paidAt,
              totalCents: record.totalCents,
            };
            return renderMail(depositReceiptSubject(props), createElement(DepositReceiptEmail, props));
          })()
        : await (async () => {
            const props = {
              shop,
              customerName: record.customer.name,
              number: record.number,
              amountCents: payment.amountCents,
              method: payment.method,
              paidAt,
              balanceDueCents: record.balanceDueCents,
            };
            return renderMail(balanceReceiptSubject(props), createElement(BalanceReceiptEmail, props));
          })();
    await sendMail({
      ...envelope(shop, record.customer.email),
      ...rendered,
      attachments: await paymentDocuments(record, paymentId),
    });
  } catch (error) {
    console.error(`[payments] the receipt for payment ${paymentId} of quote ${quoteId} was not sent`, error);
  }
}
