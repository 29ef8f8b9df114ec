import Papa from 'papaparse';

// CSV in and out of the catalogue, with papaparse. Cells a spreadsheet would run as a formula
// (starting with = + - @, a tab or a carriage return) are written with a leading apostrophe, and
// the import takes that apostrophe off again, so an export re-imports to the same values.

export const CSV_MAX_BYTES = 2 * 1024 * 1024;
const FORMULA_START = /^[=+\-@\t\r]/;

export function neutraliseCell(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}

export function unneutraliseCell(value: string): string {
  return value.length > 1 && value.startsWith("'") && FORMULA_START.test(value.slice(1)) ? value.slice(1) : value;
}

export type CsvCell = string | number | boolean | null | undefined;

/** Header row plus rows, every text cell neutralised; numbers are written as plain numbers. */
export function toCsv(header: readonly string[], rows: readonly CsvCell[][]): string {
  const safe = rows.map((row) =>
    row.map((cell) => {
      if (cell === null || cell === undefined) return '';
      if (typeof cell === 'boolean') return cell ? 'yes' : 'no';
      if (typeof cell === 'number') return Number.isFinite(cell) ? String(cell) : '';
      return neutraliseCell(cell);
    }),
  );
  return Papa.unparse({ fields: [...header], data: safe }, { quotes: false, newline: '\r\n', escapeFormulae: false });
}

export type CsvKind = 'text' | 'number' | 'integer' | 'money' | 'boolean';

export type CsvColumn<F extends string = string> = {
  name: string;
  field: F;
  kind: CsvKind;
  required?: boolean;
  /** For the documentation and the template. */
  help: string;
  example: string;
};

/** Why the file itself is not CSV text, or null when it looks like CSV. */
export function notCsvReason(bytes: Uint8Array, fileName: string, declaredType: string): string | null {
  const starts = (sig: number[]) => sig.every((b, i) => bytes[i] === b);
  if (starts([0x50, 0x4b, 0x03, 0x04]))
    return 'This looks like a spreadsheet workbook (.xlsx). Save it as "CSV UTF-8" and upload that.';
  if (starts([0xd0, 0xcf, 0x11, 0xe0]))
    return 'This looks like an old-style spreadsheet (.xls). Save it as "CSV UTF-8" and upload that.';
  if (starts([0x25, 0x50, 0x44, 0x46])) return 'This is a PDF, not a CSV file.';
  if (/\.(xlsx?|ods|numbers|pdf|png|jpe?g|zip|docx?)$/i.test(fileName))
    return `A .${fileName.split('.').pop()} file is not CSV. Save the sheet as CSV and upload that.`;
  if (
    declaredType &&
    !/^(text\/(csv|plain|comma-separated-values)|application\/(csv|vnd\.ms-excel|octet-stream))\b/i.test(declaredType)
  ) {
    return `Files of type ${declaredType} are not CSV.`;
  }
  const head = bytes.subarray(0, 64 * 1024);
  if (head.includes(0)) return 'This file holds binary data, not CSV text.';
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return 'This file is not UTF-8 text. Save it from the spreadsheet as "CSV UTF-8".';
  }
  return null;
}

export type ParsedCsv = {
  header: string[];
  rows: { row: number; cells: Record<string, string> }[];
  errors: { row: number; column: string; message: string }[];
};

/**
 * Parses CSV text: the header names are trimmed and lower-cased, blank lines are skipped, and each
 * data row keeps its spreadsheet row number (the header is row 1).
 */
export function parseCsv(text: string): ParsedCsv {
  const source = text.replace(/^\uFEFF/, '');
  const result = Papa.parse<string[]>(source, { skipEmptyLines: 'greedy' });
  const errors: ParsedCsv['errors'] = result.errors.map((e) => ({
    row: (e.row ?? 0) + 1,
    column: '(row)',
    message: e.message,
  }));
  const [headerRow = [], ...data] = result.data;
  const header = headerRow.map((h) => h.trim().toLowerCase());
  const rows = data.map((cells, index) => ({
    row: index + 2,
    cells: Object.fromEntries(header.map((name, i) => [name, unneutraliseCell((cells[i] ?? '').trim())])),
  }));
  return { header, rows, errors };
}

/** Turns one cell into a value for the schema: blank is null; numbers may carry a unit mark; money is dollars → cents. */
export function convertCell(raw: string, kind: CsvKind): { ok: true; value: unknown } | { ok: false; message: string } {
  const value = raw.trim();
  if (value === '') return { ok: true, value: null };
  switch (kind) {
    case 'text':
      return { ok: true, value };
    case 'number':
    case 'integer': {
      const cleaned = value.replace(/\s*(["°]|in|deg|°\s*|rpm)$/i, '').replace(/,/g, '');
      if (!/^[+-]?(\d+\.?\d*|\.\d+)$/.test(cleaned)) return { ok: false, message: `"${value}" is not a number` };
      const n = Number(cleaned);
      if (kind === 'integer' && !Number.isInteger(n)) return { ok: false, message: `"${value}" is not a whole number` };
      return { ok: true, value: n };
    }
    case 'money': {
      const cleaned = value.replace(/^\$/, '').replace(/,/g, '');
      const match = /^(\d+)(?:\.(\d{1,2}))?$/.exec(cleaned);
      if (!match) return { ok: false, message: `"${value}" is not an amount in dollars and cents (like 459.00)` };
      return { ok: true, value: Number(match[1]) * 100 + Number((match[2] ?? '0').padEnd(2, '0')) };
    }
    case 'boolean': {
      const v = value.toLowerCase();
      if (['yes', 'y', 'true', '1', 'x'].includes(v)) return { ok: true, value: true };
      if (['no', 'n', 'false', '0'].includes(v)) return { ok: true, value: false };
      return { ok: false, message: `"${value}" must be yes or no` };
    }
  }
}

/** Cents as dollars for a CSV cell: 45900 → "459.00". */
export function centsToDollars(cents: number): string {
  const sign = cents < 0 ? '-' : '';
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}
