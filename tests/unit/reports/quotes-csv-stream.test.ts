import type { QuoteExportRow } from '@/lib/db/queries/quote-export';
import { quoteCsvHeader, quoteCsvRows, quotesToCsv } from '@/lib/reports/quotes-csv';
import { goodsMargin, marginOfSums } from '@/lib/reports/arithmetic';
import { textSearch } from '@/lib/db/queries/text-search';

// The streamed CSV must be byte for byte the file the one-piece export made, however it is chunked.
const row = (n: number, customerName: string): QuoteExportRow => ({
  number: `Q-2026-${String(n).padStart(4, '0')}`,
  status: 'sent',
  createdAt: '2026-11-30T10:00:00.000Z',
  sentAt: null,
  customerName,
  vehicleLabel: 'crew-cab pickup',
  camSku: null,
  subtotalCents: 10_000,
  taxCents: 825,
  totalCents: 10_825,
  depositCents: 2_165,
  paidCents: 0,
  refundedCents: 0,
});

describe('the quotes CSV in chunks', () => {
  it('header plus chunks equals the whole file, formula cells neutralised and quoted cells intact', () => {
    const rows = [
      row(1, 'Orrin Tallowmere'),
      row(2, '=SUM(A1:A9)'),
      row(3, 'Line one\nline "two"'),
      row(4, 'Ysolde, Kettleby'),
    ];
    const streamed = `${quoteCsvHeader()}\r\n${quoteCsvRows(rows.slice(0, 3))}${quoteCsvRows(rows.slice(3))}${quoteCsvRows([])}`;
    expect(streamed).toBe(`${quotesToCsv(rows)}\r\n`);
    expect(streamed).toContain("'=SUM(A1:A9)");
  });

  it('an empty range is the header line alone', () => {
    expect(`${quoteCsvHeader()}\r\n${quoteCsvRows([])}`.split('\r\n')).toEqual([quoteCsvHeader(), '']);
  });
});

describe('margin of summed lines', () => {
  it('equals the margin worked out line by line when the sums are the same', () => {
    const lines = [
      { totalCents: 30_000, quantityHundredths: 100, unitCostCents: 24_118 },
      { totalCents: 19_200, quantityHundredths: 1_600, unitCostCents: 950 },
    ];
    // Cost per line: 24,118 and 16 × 950 = 15,200 (hand-worked); revenue 49,200.
    expect(marginOfSums(49_200, 39_318)).toEqual(goodsMargin(lines));
    expect(marginOfSums(0, 0).marginBp).toBeNull();
  });
});

describe('search words to an indexed condition', () => {
  it('full-text word prefixes for words of three characters or more, a name prefix below that, nothing for punctuation', () => {
    expect(textSearch('Kowal anna')).toEqual({ kind: 'fulltext', against: '+Kowal* +anna*' });
    expect(textSearch('555-0987')).toEqual({ kind: 'fulltext', against: '+555* +0987*' });
    // Boolean-mode operators never reach AGAINST: they are cut like any other punctuation.
    expect(textSearch('+(x) -"Ada*" ~Bo<>')).toEqual({ kind: 'fulltext', against: '+Ada*' });
    expect(textSearch('Al')).toEqual({ kind: 'prefix', like: 'Al%' });
    expect(textSearch('5%_')).toEqual({ kind: 'prefix', like: '5\\%\\_%' });
    expect(textSearch('%%%')).toEqual({ kind: 'nothing' });
  });
});
