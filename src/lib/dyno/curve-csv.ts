import Papa from 'papaparse';

// A pull pasted or uploaded from the dyno software as CSV: one "rpm,torque" row per point (lb·ft), an
// optional header row, commas, semicolons or tabs. Pure; the form runs it, the schema then checks the
// limits. Blank lines are kept while parsing so every message names the line the technician sees.

export type CsvPoint = { rpm: number; torqueLbFt: number };

/** What the downloadable template holds: the header the parser skips and three example points. */
export const CURVE_CSV_TEMPLATE = 'rpm,torque_lbft\n3000,352.4\n3500,371.0\n4000,380.2\n';
/** A long pull logged every 50 rpm is about 8 kB; anything far bigger is not a pull. */
export const CURVE_CSV_MAX_BYTES = 100_000;

export function parseCurveCsv(text: string): { points: CsvPoint[]; lines: number[]; errors: string[] } {
  const parsed = Papa.parse<string[]>(text.replace(/\s+$/, ''), {
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t'],
  });
  const points: CsvPoint[] = [];
  const lines: number[] = [];
  const errors: string[] = [];
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
      return;
    }
    points.push({ rpm: numeric[0], torqueLbFt: numeric[1] });
    lines.push(i + 1);
  });
  if (!points.length && !errors.length) errors.push('no rows: paste one "rpm,torque" line per point');
  return { points, lines, errors };
}
