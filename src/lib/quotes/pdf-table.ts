import { formatMoney } from '@/lib/format';
import { palette } from '@/lib/palette';
import { isTaxable, type QuoteLineKind } from './pricing';

// The money table the quote, the receipt and the invoice share (pdfkit): labels on the left, amounts in a
// right-aligned column, the quote's lines each with a small line of detail under their description.
// One layout, so the three documents a customer keeps line up with each other.

const AMOUNT_WIDTH = 110;
const GAP = 10;

export type TableLine = {
  kind: QuoteLineKind;
  description: string;
  quantity: number;
  unitPriceCents: number;
  discountCents: number;
  totalCents: number;
};

/** "2 × $45.00, $5.00 off", "8 h of labour at $135.00, no sales tax". */
export function lineDetail(line: TableLine): string {
  const price = formatMoney(line.unitPriceCents);
  const amount = line.kind === 'labor' ? `${line.quantity} h of labour at ${price}` : `${line.quantity} × ${price}`;
  const discount = line.discountCents ? `, ${formatMoney(line.discountCents)} off` : '';
  return `${amount}${discount}${isTaxable(line.kind) ? '' : ', no sales tax'}`;
}

export function moneyTable(doc: PDFKit.PDFDocument, left: number, width: number) {
  const labelWidth = width - AMOUNT_WIDTH - GAP;
  const amountX = left + width - AMOUNT_WIDTH;
  const rule = (y: number) =>
    doc
      .moveTo(left, y)
      .lineTo(left + width, y)
      .stroke(palette.steel[500]);
  const amount = (cents: number, y: number) =>
    doc.text(formatMoney(cents), amountX, y, { width: AMOUNT_WIDTH, align: 'right' });

  return {
    /** A label and its amount on one line; `strong` for the totals that matter. */
    row(label: string, cents: number, strong = false) {
      const y = doc.y;
      doc
        .font(strong ? 'bold' : 'regular')
        .fontSize(strong ? 12 : 10)
        .text(label, left, y, { width: labelWidth });
      amount(cents, y);
      doc.x = left;
    },
    /** The lines under a ruled heading, ruled off below. */
    lines(heading: string, lines: readonly TableLine[]) {
      doc.font('bold').fontSize(10).text(heading, left, doc.y, { width: labelWidth });
      rule(doc.y + 2);
      doc.moveDown(0.5);
      for (const line of lines) {
        const y = doc.y;
        doc.font('regular').fontSize(10).text(line.description, left, y, { width: labelWidth });
        doc
          .fontSize(8)
          .fillColor(palette.ink.muted)
          .text(lineDetail(line), { width: labelWidth })
          .fillColor(palette.ink.DEFAULT);
        const after = doc.y;
        doc.fontSize(10);
        amount(line.totalCents, y);
        doc.y = Math.max(after, doc.y) + 4;
        doc.x = left;
      }
      rule(doc.y);
      doc.moveDown(0.5);
    },
  };
}
