import fs from 'node:fs';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import { longDate, percentFromBp } from '@/lib/format';
import { palette } from '@/lib/palette';
import { CUSTOMER_CAUTIONS, REFUND_NOTE } from './cautions';
import type { QuoteRecord } from './types';
import { moneyTable, type TableLine } from './pdf-table';

// The printable quote as a PDF (pdfkit). Fonts are the app's own Inter files (TrueType copies of the
// WOFF2 the pages use, in src/app/fonts; pdfkit cannot subset the WOFF2 ones), so nothing is fetched
// at run time. No costs or margins: the same figures the customer's page shows.

/** The money and dates are the quote record's own, so the document can never drift from it. */
type QuoteFigures = Pick<
  QuoteRecord,
  | 'subtotalCents'
  | 'taxRateBp'
  | 'taxCents'
  | 'totalCents'
  | 'depositCents'
  | 'paidCents'
  | 'refundedCents'
  | 'validUntil'
  | 'sentAt'
>;

export type QuoteDocument = QuoteFigures & {
  number: string;
  stateWord: string;
  customerName: string;
  vehicleLabel: string | null;
  lines: TableLine[];
  replacedBy: string | null;
  shop: { name: string; address: string; phone: string; email: string; depositPolicyText: string };
};

const FONT_DIR = path.join(process.cwd(), 'src', 'app', 'fonts');

let fonts: { regular: Buffer; bold: Buffer } | undefined;
function loadFonts() {
  fonts ??= {
    regular: fs.readFileSync(path.join(FONT_DIR, 'inter-latin-400-normal.ttf')),
    bold: fs.readFileSync(path.join(FONT_DIR, 'inter-latin-700-normal.ttf')),
  };
  return fonts;
}

/** A letter-size document in the app's fonts with the shop's name and contacts at the top; `done` is its bytes. */
export function openPdf(
  title: string,
  shop: { name: string; address: string; phone: string; email: string },
  options: { compress?: boolean } = {},
) {
  const { regular, bold } = loadFonts();
  // `font` replaces pdfkit's default Helvetica, whose metrics file a bundled server may not find.
  const doc = new PDFDocument({
    size: 'LETTER',
    margin: 54,
    font: regular as unknown as string,
    compress: options.compress ?? true,
    info: { Title: title, Author: shop.name },
  });
  doc.registerFont('regular', regular);
  doc.registerFont('bold', bold);
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.font('bold').fontSize(16).text(shop.name);
  doc.font('regular').fontSize(9).fillColor(palette.ink.muted);
  for (const line of [shop.address, shop.phone && `Phone ${shop.phone}`, shop.email].filter(Boolean))
    doc.text(String(line));
  return { doc, done, left: 54, width: doc.page.width - 108 };
}

export function quotePdf(q: QuoteDocument, options: { compress?: boolean } = {}): Promise<Buffer> {
  const { doc, done, left, width } = openPdf(`Quote ${q.number}`, q.shop, options);

  doc.moveDown().fillColor(palette.ink.DEFAULT).font('bold').fontSize(20).text(`Quote ${q.number}`);
  doc
    .font('regular')
    .fontSize(10)
    .text(`For ${q.customerName}${q.vehicleLabel ? `, ${q.vehicleLabel}` : ''}`);
  doc.text(`Status: ${q.stateWord}`);
  if (q.sentAt) doc.text(`Sent ${longDate(q.sentAt)}`);
  if (q.validUntil)
    doc.text(`Valid until ${longDate(q.validUntil)} (prices and parts after that day need a fresh quote)`);
  if (q.replacedBy) doc.font('bold').text(`Replaced by a newer quote: ${q.replacedBy}`).font('regular');
  doc.moveDown();

  const { row, lines } = moneyTable(doc, left, width);
  lines('What is included', q.lines);
  row('Before tax', q.subtotalCents);
  row(`Sales tax (${percentFromBp(q.taxRateBp)} on parts and goods)`, q.taxCents);
  row('Total', q.totalCents, true);
  row('Deposit to book the job', q.depositCents, true);
  row('Balance when the job is done', Math.max(0, q.totalCents - q.depositCents));
  if (q.paidCents) row('Deposit paid', q.paidCents);
  if (q.refundedCents) row('Refunded', q.refundedCents);

  doc.moveDown().font('bold').fontSize(12).text('Deposit and refund policy', left);
  doc.font('regular').fontSize(9).text(q.shop.depositPolicyText, { width });
  doc.moveDown(0.3).text(REFUND_NOTE, { width });
  doc.moveDown().font('bold').fontSize(12).text('Good to know before a cam swap');
  doc.font('regular').fontSize(9);
  for (const caution of CUSTOMER_CAUTIONS) doc.text(`• ${caution}`, { width }).moveDown(0.2);
  doc
    .moveDown()
    .fontSize(8)
    .fillColor(palette.ink.muted)
    .text('Predicted gains are indicative; the dyno has the last word.', { width });
  doc.end();
  return done;
}
