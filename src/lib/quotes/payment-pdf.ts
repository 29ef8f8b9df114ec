import { longDate, percentFromBp } from '@/lib/format';
import { palette } from '@/lib/palette';
import type { QuoteRecord } from './types';
import { counts, invoiceNumber, METHOD_WORDS, PURPOSE_WORDS, receiptNumber } from './balance';
import { openPdf } from './pdf';
import { moneyTable } from './pdf-table';

// A receipt for one payment and the final invoice of a job paid in full, as PDFs (pdfkit, the app's
// own Inter). Every figure comes from the quote as it was sent and paid: its stored lines, tax and
// total and its payments — never from today's catalogue, so a later price change cannot alter a
// document the customer already holds. No costs or margins, no provider ids, no staff names.

export type DocumentShop = { name: string; address: string; phone: string; email: string };

function startDocument(title: string, shop: DocumentShop) {
  const { doc, done, left, width } = openPdf(title, shop);
  doc.moveDown().fillColor(palette.ink.DEFAULT);
  return { doc, done, left, width, ...moneyTable(doc, left, width) };
}

const forWhom = (q: QuoteRecord) => `For ${q.customer.name}${q.build ? `, ${q.build.vehicleLabel}` : ''}`;

/** The payments that took money, oldest first (the id breaks ties). */
const takenPayments = (q: QuoteRecord) =>
  q.payments.filter(counts).sort((a, b) => (a.paidAt ?? '').localeCompare(b.paidAt ?? '') || a.id - b.id);

/** One payment's receipt: what, how, when, and where the account stood once it was taken. */
export function receiptPdf(q: QuoteRecord, paymentId: number, shop: DocumentShop): Promise<Buffer> {
  const taken = takenPayments(q);
  const index = taken.findIndex((p) => p.id === paymentId);
  if (index < 0) throw new Error(`payment ${paymentId} of quote ${q.number} took no money`);
  const payment = taken[index];
  const paidThrough = taken.slice(0, index + 1).reduce((s, p) => s + p.amountCents, 0);
  const { doc, done, left, width, row } = startDocument(`Receipt ${receiptNumber(q.number, payment.id)}`, shop);
  doc
    .font('bold')
    .fontSize(20)
    .text(`Receipt ${receiptNumber(q.number, payment.id)}`);
  doc.font('regular').fontSize(10).text(forWhom(q));
  doc.text(`Quote ${q.number}`);
  if (payment.paidAt) doc.text(`Received ${longDate(payment.paidAt)}`);
  doc.text(`${PURPOSE_WORDS[payment.purpose]} · ${METHOD_WORDS[payment.method]}`);
  doc.moveDown();
  row(`${PURPOSE_WORDS[payment.purpose]} received`, payment.amountCents, true);
  if (payment.refundedCents) row('Refunded since', payment.refundedCents);
  doc.moveDown(0.5);
  row('Quote total', q.totalCents);
  row('Paid up to and including this payment', paidThrough);
  row('Left to pay after this payment', Math.max(0, q.totalCents - paidThrough));
  doc
    .moveDown()
    .fontSize(9)
    .fillColor(palette.ink.muted)
    .text('Keep this receipt. Refunds, if any, are shown on your quote page and on the final invoice.', left, doc.y, {
      width,
    });
  doc.end();
  return done;
}

/** The final invoice: the quote's own lines and totals, every payment, and nothing left to pay. */
export function invoicePdf(q: QuoteRecord, shop: DocumentShop): Promise<Buffer> {
  const { doc, done, left, width, row, lines } = startDocument(`Invoice ${invoiceNumber(q.number)}`, shop);
  doc
    .font('bold')
    .fontSize(20)
    .text(`Invoice ${invoiceNumber(q.number)}`);
  doc.font('regular').fontSize(10).text(forWhom(q));
  doc.text(`For the work quoted in ${q.number}`);
  doc
    .font('bold')
    .text(q.closedAt ? `Paid in full · closed ${longDate(q.closedAt)}` : 'Paid in full')
    .font('regular');
  doc.moveDown();
  lines('Work and parts', q.lines);
  row('Before tax', q.subtotalCents);
  row(`Sales tax (${percentFromBp(q.taxRateBp)} on parts and goods)`, q.taxCents);
  row('Total', q.totalCents, true);
  doc.moveDown().font('bold').fontSize(12).text('Payments', left);
  for (const p of takenPayments(q)) {
    row(
      `${p.paidAt ? longDate(p.paidAt) : ''} · ${PURPOSE_WORDS[p.purpose]} · ${METHOD_WORDS[p.method]} · receipt ${receiptNumber(q.number, p.id)}`,
      p.amountCents,
    );
    if (p.refundedCents) row('    refunded', -p.refundedCents);
  }
  doc.moveDown(0.5);
  row('Paid in all', q.paidCents - q.refundedCents, true);
  row('Balance due', q.balanceDueCents, true);
  doc
    .moveDown()
    .fontSize(9)
    .fillColor(palette.ink.muted)
    .text('Thank you. Predicted gains were indicative; the dyno has the last word.', left, doc.y, { width });
  doc.end();
  return done;
}
