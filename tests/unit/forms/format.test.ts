import { centsFromText, centsToText, formatMoney, longDate, percentFromBp, rpmRangeText } from '@/lib/format';
import { amountWithin } from '@/lib/forms/amount';
import { fromPrice, jobPrice } from '@/lib/leads/shortlist';

describe('lib/format', () => {
  it('formats integer cents in the shop currency, whole or with cents, and a dash for nothing', () => {
    expect(formatMoney(123450)).toBe('$1,234.50');
    expect(formatMoney(123450, { whole: true })).toBe('$1,235');
    expect(formatMoney(99, { currency: 'cad' })).toBe('CA$0.99');
    expect(formatMoney(null)).toBe('—');
  });

  it('reads typed dollars into exact cents and refuses what is not money', () => {
    expect(centsFromText('129.5')).toBe(12950);
    expect(centsFromText('$1,212.05')).toBe(121205);
    expect(centsFromText('12.345')).toBeNull();
    expect(centsFromText('ten')).toBeNull();
  });

  it('writes cents back into a money box as centsFromText reads them', () => {
    expect(centsToText(121205)).toBe('1212.05');
    expect(centsToText(5)).toBe('0.05');
    expect(centsFromText(centsToText(987654))).toBe(987654);
  });

  it('prices the customer shortlist through the one formatter: to the cent, or "from" whole dollars rounded down', () => {
    expect(jobPrice(300700)).toBe('$3,007.00');
    expect(fromPrice(125099)).toBe('from $1,250');
  });

  it('keeps a calendar day on its day whatever the time zone, and rates as percents', () => {
    expect(longDate('2026-03-01')).toBe('March 1, 2026');
    expect(longDate('2026-03-01T23:59:00.000Z')).toBe('March 1, 2026');
    expect(percentFromBp(825)).toBe('8.25 %');
    expect(percentFromBp(1500, 2)).toBe('15.00 %');
    expect(rpmRangeText([2300, 2700])).toBe('2,300–2,700 rpm');
  });
});

describe('an amount typed at the counter', () => {
  it('reads it into cents within what is left, or says what is wrong', () => {
    expect(amountWithin('120.50', 20000, 'pay')).toEqual({ cents: 12050 });
    expect(amountWithin('0', 20000, 'pay')).toEqual({ problem: 'The amount must be dollars and cents above 0.' });
    expect(amountWithin('12.345', 20000, 'refund')).toEqual({
      problem: 'The amount must be dollars and cents above 0.',
    });
    expect(amountWithin('200.01', 20000, 'refund')).toEqual({ problem: 'At most $200.00 is left to refund.' });
  });
});
