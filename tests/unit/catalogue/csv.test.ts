import {
  centsToDollars,
  convertCell,
  neutraliseCell,
  notCsvReason,
  parseCsv,
  toCsv,
  unneutraliseCell,
} from '@/lib/catalogue/csv';

describe('catalogue CSV helpers', () => {
  it.each(['=1+1', '+1', '-1', '@x', '\tx', '\rx'])(
    'neutralises %j with a leading apostrophe and takes it off again',
    (cell) => {
      expect(neutraliseCell(cell)).toBe(`'${cell}`);
      expect(unneutraliseCell(neutraliseCell(cell))).toBe(cell);
    },
  );

  it('leaves ordinary text alone, including a real leading apostrophe', () => {
    expect(neutraliseCell('Tow Boss 198')).toBe('Tow Boss 198');
    expect(unneutraliseCell("'Tis a cam")).toBe("'Tis a cam");
  });

  it('writes a header and rows with formulas neutralised and commas quoted', () => {
    const csv = toCsv(
      ['sku', 'name', 'price'],
      [
        ['A-1', '=cmd', 4.5],
        ['B-2', 'one, two', null],
      ],
    );
    expect(csv).toBe('sku,name,price\r\nA-1,\'=cmd,4.5\r\nB-2,"one, two",');
    const parsed = parseCsv(csv);
    expect(parsed.rows[0]).toEqual({ row: 2, cells: { sku: 'A-1', name: '=cmd', price: '4.5' } });
  });

  it('converts money in dollars to exact cents and refuses fractions of a cent', () => {
    expect(convertCell('$1,049.5', 'money')).toEqual({ ok: true, value: 104950 });
    expect(convertCell('0.29', 'money')).toEqual({ ok: true, value: 29 });
    expect(convertCell('12.345', 'money').ok).toBe(false);
    expect(centsToDollars(104950)).toBe('1049.50');
  });

  it('reads numbers with a unit mark, and yes/no flags', () => {
    expect(convertCell('0.550"', 'number')).toEqual({ ok: true, value: 0.55 });
    expect(convertCell('214°', 'number')).toEqual({ ok: true, value: 214 });
    expect(convertCell('wide', 'number').ok).toBe(false);
    expect(convertCell('Yes', 'boolean')).toEqual({ ok: true, value: true });
    expect(convertCell('', 'boolean')).toEqual({ ok: true, value: null });
  });

  it('tells a workbook and binary data from CSV', () => {
    expect(notCsvReason(Buffer.from('sku,name\n'), 'a.csv', 'text/csv')).toBeNull();
    expect(notCsvReason(Buffer.from([0x50, 0x4b, 0x03, 0x04]), 'a.csv', 'text/csv')).toMatch(/workbook/);
    expect(notCsvReason(Buffer.from([0x61, 0x00]), 'a.csv', '')).toMatch(/binary/);
    expect(notCsvReason(Buffer.from([0xc3, 0x28]), 'a.csv', '')).toMatch(/UTF-8/);
  });
});
