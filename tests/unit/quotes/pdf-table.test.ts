import { lineDetail } from '@/lib/quotes/pdf-table';
import { quotePdf, type QuoteDocument } from '@/lib/quotes/pdf';
import { pdfText } from '../../support/pdf-text';

// The table the quote, the receipt and the invoice share (src/lib/quotes/pdf-table.ts). Amounts worked
// out by hand: 8 h at $135.00 is $1,080.00; 2 × $45.50 less $5.00 is $86.00.

const labour = {
  kind: 'labor' as const,
  description: 'Cam swap, truck',
  quantity: 8,
  unitPriceCents: 13_500,
  discountCents: 0,
  totalCents: 108_000,
};
const part = {
  kind: 'part' as const,
  description: 'Invented spring kit',
  quantity: 2,
  unitPriceCents: 4_550,
  discountCents: 500,
  totalCents: 8_600,
};

describe('lineDetail', () => {
  it('says hours of labour, untaxed', () => {
    expect(lineDetail(labour)).toBe('8 h of labour at $135.00, no sales tax');
  });

  it('says quantity and price of goods, with the discount', () => {
    expect(lineDetail(part)).toBe('2 × $45.50, $5.00 off');
  });
});

describe('the quote PDF draws its lines through the shared table', () => {
  it('shows each line with its detail and amount, then the totals', async () => {
    const doc: QuoteDocument = {
      number: 'Q-TEST-0001',
      stateWord: 'Sent',
      customerName: 'Invented Customer',
      vehicleLabel: 'Invented pickup',
      lines: [labour, part],
      replacedBy: null,
      shop: {
        name: 'Invented Shop',
        address: '1 Nowhere Road',
        phone: '',
        email: 'shop@example.com',
        depositPolicyText: 'Invented policy.',
      },
      subtotalCents: 116_600,
      taxRateBp: 825,
      taxCents: 710,
      totalCents: 117_310,
      depositCents: 23_462,
      paidCents: 0,
      refundedCents: 0,
      validUntil: null,
      sentAt: null,
    };
    const text = pdfText(await quotePdf(doc, { compress: false }));
    for (const words of [
      'What is included',
      'Cam swap, truck',
      '8 h of labour at $135.00, no sales tax',
      '$1,080.00',
      '2 × $45.50, $5.00 off',
      '$86.00',
      '$1,173.10',
    ])
      expect(text).toContain(words);
  });
});
