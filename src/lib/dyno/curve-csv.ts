import Papa from 'papaparse';

// A pull pasted from the dyno software as CSV: one "rpm,torque" row per point (lb·ft), an optional
// header row, commas, semicolons or tabs. Pure; the form runs it, the schema then checks the limits.

export type CsvPoint = { rpm: number; torqueLbFt: number };

export function parseCurveCsv(text: string): { points: CsvPoint[]; errors: string[] } {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t'] });
  const points: CsvPoint[] = [];
  const errors: string[] = [];
  parsed.data.forEach((row, i) => {
    const cells = row.map((c) => c.trim());
    const numeric = cells.slice(0, 2).map((c) => (c === '' ? NaN : Number(c)));
    if (i === 0 && numeric.some((n) => Number.isNaN(n))) return; // a header row such as "rpm,torque"
    if (cells.length < 2 || numeric.some((n) => !Number.isFinite(n))) {
      errors.push(`line ${i + 1}: expected two numbers, rpm and torque in lb·ft (got "${cells.join(',')}")`);
      return;
    }
    points.push({ rpm: numeric[0], torqueLbFt: numeric[1] });
  });
  if (!points.length && !errors.length) errors.push('no rows: paste one "rpm,torque" line per point');
  return { points, errors };
}
