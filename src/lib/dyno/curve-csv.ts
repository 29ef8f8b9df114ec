import Papa from 'papaparse';
import { CurvePointSchema, DYNO_LIMITS } from '@/lib/schemas/dyno-run';

// A pull pasted or uploaded from the dyno software as CSV: one "rpm,torque" row per point (lb·ft), an
// optional header row, commas, semicolons or tabs. Pure, so the job page (while typing) and
// POST /api/dyno-runs/pull-csv (for an uploaded file) run the same function. Blank lines are kept while
// parsing so every message names the line (row) of the file the technician sees.

export type CsvPoint = { rpm: number; torqueLbFt: number };
export type CurveCsvColumn = 'rpm' | 'torque' | '(row)';
/** One problem, by the file's 1-based row and the column it is in. */
export type CurveCsvProblem = { row: number; column: CurveCsvColumn; message: string };

/** What the downloadable template holds: the header the parser skips and three example points. */
export const CURVE_CSV_TEMPLATE = 'rpm,torque_lbft\n3000,352.4\n3500,371.0\n4000,380.2\n';
/** A long pull logged every 50 rpm is about 8 kB; anything far bigger is not a pull. */
export const CURVE_CSV_MAX_BYTES = 100_000;

/**
 * The separator found on the most non-blank lines; on a tie tab, then semicolon (a "3000;352,4" file uses the
 * comma for decimals). Chosen here, not by papaparse's guess, which blank lines kept for numbering throw off.
 */
function delimiterOf(text: string): string {
  const lines = text.split(/\r\n|\n|\r/).filter((line) => line.trim() !== '');
  const score = (d: string) => lines.filter((line) => line.includes(d)).length;
  return ['\t', ';', ','].reduce((best, d) => (score(d) > score(best) ? d : best), ',');
}

export function parseCurveCsv(text: string): {
  points: CsvPoint[];
  lines: number[];
  errors: string[];
  problems: CurveCsvProblem[];
} {
  const source = text.replace(/^\uFEFF/, '').replace(/\s+$/, '');
  const parsed = Papa.parse<string[]>(source, { skipEmptyLines: false, delimiter: delimiterOf(source) });
  const points: CsvPoint[] = [];
  const lines: number[] = [];
  const errors: string[] = [];
  const problems: CurveCsvProblem[] = [];
  let seenRow = false;
  parsed.data.forEach((row, i) => {
    const cells = row.map((c) => c.trim());
    if (cells.every((c) => c === '')) return;
    const numeric = cells.slice(0, 2).map((c) => (c === '' ? NaN : Number(c)));
    const first = !seenRow;
    seenRow = true;
    if (first && numeric.some((n) => Number.isNaN(n))) return; // a header row such as "rpm,torque"
    if (cells.length < 2 || numeric.some((n) => !Number.isFinite(n))) {
      errors.push(`line ${i + 1}: expected two numbers, rpm and torque in lb·ft (got "${cells.join(',')}")`);
      // The first column that is not a number; a row with one cell lacks its torque.
      const column: CurveCsvColumn = Number.isFinite(numeric[0]) ? 'torque' : 'rpm';
      problems.push({ row: i + 1, column, message: `expected a number (got "${cells.join(',')}")` });
      return;
    }
    points.push({ rpm: numeric[0], torqueLbFt: numeric[1] });
    lines.push(i + 1);
  });
  if (!points.length && !errors.length) {
    errors.push('no rows: paste one "rpm,torque" line per point');
    problems.push({ row: 1, column: '(row)', message: 'no rows: one "rpm,torque" line per point' });
  }
  return { points, lines, errors, problems };
}

/**
 * The whole check of a pull file, as the API answers it: the parse above, then each point against the
 * run schema's limits (CurvePointSchema, so the same words as POST /api/dyno-runs), rpm rising, and the
 * number of points. Every problem names the file's row and column; an empty list means `points` is a
 * curve POST /api/dyno-runs takes.
 */
export function checkCurveCsv(text: string): { points: CsvPoint[]; lines: number[]; problems: CurveCsvProblem[] } {
  const { points, lines, problems } = parseCurveCsv(text);
  const out = [...problems];
  points.forEach((point, i) => {
    const result = CurvePointSchema.safeParse(point);
    if (!result.success)
      for (const issue of result.error.issues)
        out.push({ row: lines[i], column: issue.path[0] === 'rpm' ? 'rpm' : 'torque', message: issue.message });
    if (i > 0 && point.rpm <= points[i - 1].rpm)
      out.push({
        row: lines[i],
        column: 'rpm',
        message: `rpm must rise from point to point (${point.rpm} after ${points[i - 1].rpm})`,
      });
  });
  const { min, max } = DYNO_LIMITS.curvePoints;
  if (!problems.length && (points.length < min || points.length > max))
    out.push({
      row: lines[lines.length - 1] ?? 1,
      column: '(row)',
      message: `a pull needs ${min}–${max} points; this file has ${points.length}`,
    });
  out.sort((a, b) => a.row - b.row || a.column.localeCompare(b.column));
  return { points, lines, problems: out };
}

/** "row 6, column torque: expected a number" — how the page and the API's `errors` word a problem. */
export function problemText(problem: CurveCsvProblem): string {
  return problem.column === '(row)'
    ? `row ${problem.row}: ${problem.message}`
    : `row ${problem.row}, column ${problem.column}: ${problem.message}`;
}
