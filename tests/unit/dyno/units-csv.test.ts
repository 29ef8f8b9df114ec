import { checkCurveCsv, parseCurveCsv } from '@/lib/dyno/curve-csv';
import { KPA_PER_INHG } from '@/lib/dyno/correction';
import {
  baroIn,
  baroToKpa,
  celsiusFromFahrenheit,
  fahrenheitFromCelsius,
  inHgFromKpa,
  kpaFromInHg,
  rangeIn,
  roundTo,
  tempIn,
  tempToCelsius,
} from '@/lib/dyno/units';
import { DynoRunSchema } from '@/lib/schemas/dyno-run';

// Shop units at the edge, SI inside: °F = °C × 9/5 + 32 (definition of the Fahrenheit scale);
// 1 inHg = 3.38639 kPa: the conventional inch of mercury, a column of mercury at 0 °C under standard gravity
// (13,595.1 kg/m³ × 9.80665 m/s² × 0.0254 m = 3,386.39 Pa); the same constant as the J607 correction.
describe('air units', () => {
  it('uses the conventional inch of mercury (at 0 °C): 1 inHg = 3.38639 kPa', () => {
    expect(kpaFromInHg(1)).toBeCloseTo(3.38639, 5);
    expect(KPA_PER_INHG).toBeCloseTo((13_595.1 * 9.80665 * 0.0254) / 1000, 5);
    // A standard day in both sets of units: 29.92 inHg is 101.32 kPa; 100 kPa reads 29.53 inHg.
    expect(roundTo(inHgFromKpa(100), 2)).toBe(29.53);
    expect(roundTo(baroIn('imperial', 101.325), 2)).toBe(29.92);
    expect(baroIn('metric', 101.325)).toBe(101.325);
    expect(roundTo(tempIn('imperial', 25), 1)).toBe(77);
    expect(tempIn('metric', 25)).toBe(25);
    expect(tempIn('imperial', -40)).toBe(-40); // the one reading both scales share
  });

  it('gives back the typed value after a trip through SI, in either units', () => {
    for (const f of [-4, 0, 59, 68.5, 140]) expect(tempIn('imperial', tempToCelsius('imperial', f))).toBeCloseTo(f, 10);
    for (const inHg of [20.68, 29.92, 32.48])
      expect(baroIn('imperial', baroToKpa('imperial', inHg))).toBeCloseTo(inHg, 10);
    expect(tempToCelsius('metric', 21.5)).toBe(21.5);
    expect(baroToKpa('metric', 98.7)).toBe(98.7);
  });

  it('converts the fixed points of water and a standard day both ways', () => {
    expect(fahrenheitFromCelsius(0)).toBe(32);
    expect(fahrenheitFromCelsius(100)).toBe(212);
    expect(celsiusFromFahrenheit(77)).toBe(25);
    expect(tempToCelsius('imperial', 59)).toBe(15);
    expect(tempToCelsius('metric', 59)).toBe(59);
    // 29.92 inHg × 3.386389 = 101.3208 kPa (standard sea-level pressure is 101.325 kPa).
    expect(kpaFromInHg(29.92)).toBeCloseTo(101.3208, 4);
    expect(inHgFromKpa(kpaFromInHg(29.53))).toBeCloseTo(29.53, 10);
    expect(baroToKpa('metric', 99)).toBe(99);
  });

  it('shows the schema’s SI limits in shop units, rounded inwards so a shown value always passes', () => {
    // −20 °C = −4 °F, 60 °C = 140 °F; 70 kPa = 20.671 inHg → 20.68, 110 kPa = 32.483 inHg → 32.48.
    expect(rangeIn('imperial', 'temp', { min: -20, max: 60 })).toEqual({ min: -4, max: 140 });
    expect(rangeIn('imperial', 'baro', { min: 70, max: 110 })).toEqual({ min: 20.68, max: 32.48 });
    expect(rangeIn('metric', 'baro', { min: 70, max: 110 })).toEqual({ min: 70, max: 110 });
    expect(kpaFromInHg(20.68)).toBeGreaterThanOrEqual(70);
    expect(kpaFromInHg(32.48)).toBeLessThanOrEqual(110);
  });
});

describe('pull CSV line numbers', () => {
  it('names the line the technician sees, counting the header and blank lines', () => {
    const parsed = parseCurveCsv('rpm,torque\n3000,300\n\n3500,310\n4000;x\n');
    expect(parsed.points).toEqual([
      { rpm: 3000, torqueLbFt: 300 },
      { rpm: 3500, torqueLbFt: 310 },
    ]);
    expect(parsed.lines).toEqual([2, 4]);
    expect(parsed.errors).toEqual(['line 5: expected two numbers, rpm and torque in lb·ft (got "4000;x")']);
  });
  it('skips a header only on the first non-blank line', () => {
    expect(parseCurveCsv('\n\nrpm,torque\n3000,300').lines).toEqual([4]);
    expect(parseCurveCsv('3000,300\nrpm,torque').errors).toEqual([
      'line 2: expected two numbers, rpm and torque in lb·ft (got "rpm,torque")',
    ]);
  });
});

describe('pull CSV checked as the server does (checkCurveCsv)', () => {
  it('names the row and column of each problem, in row order', () => {
    const checked = checkCurveCsv('\uFEFFrpm,torque\n3000,0\n3500,abc\nx,1\n3400,320\n4000.5,330\n');
    expect(checked.problems).toEqual([
      { row: 2, column: 'torque', message: 'torque must be at least 1 lb·ft' },
      { row: 3, column: 'torque', message: 'expected a number (got "3500,abc")' },
      { row: 4, column: 'rpm', message: 'expected a number (got "x,1")' },
      { row: 6, column: 'rpm', message: 'rpm must be a whole number of rpm' },
    ]);
  });
  it('reads semicolons and Windows line ends with a blank line kept for numbering', () => {
    const checked = checkCurveCsv('rpm;torque_lbft\r\n3000;352.4\r\n\r\n3500;371\r\n4000;380.2\r\n');
    expect(checked.problems).toEqual([]);
    expect(checked.lines).toEqual([2, 4, 5]);
    expect(checkCurveCsv('3000\t300\n\n3500\t310\n4000\t320').lines).toEqual([1, 3, 4]);
  });
  it('reports rpm that does not rise, and too few points only when every row read', () => {
    expect(checkCurveCsv('3000,300\n3000,310\n3500,320').problems).toEqual([
      { row: 2, column: 'rpm', message: 'rpm must rise from point to point (3000 after 3000)' },
    ]);
    expect(checkCurveCsv('3000,300\n3500,310').problems).toEqual([
      { row: 2, column: '(row)', message: 'a pull needs 3–400 points; this file has 2' },
    ]);
    expect(checkCurveCsv('rpm,torque_lbft\n3000,352.4\n3500,371.0\n4000,380.2\n')).toEqual({
      points: [
        { rpm: 3000, torqueLbFt: 352.4 },
        { rpm: 3500, torqueLbFt: 371 },
        { rpm: 4000, torqueLbFt: 380.2 },
      ],
      lines: [2, 3, 4],
      problems: [],
    });
  });
});

describe('air readings by correction standard (the route’s schema)', () => {
  const curve = [
    { rpm: 3000, torqueLbFt: 300 },
    { rpm: 4000, torqueLbFt: 320 },
    { rpm: 5000, torqueLbFt: 310 },
  ];
  const fields = (body: object) => {
    const result = DynoRunSchema.safeParse({ buildId: 1, phase: 'before', curve, ...body });
    return result.success ? [] : result.error.issues.map((i) => i.path.join('.'));
  };
  it('needs all three for SAE J1349 and J607, temperature and pressure for DIN 70020, none without correction', () => {
    expect(fields({ correctionStandard: 'sae-j1349' })).toEqual(['airTempC', 'baroKpa', 'humidityPct']);
    expect(fields({ correctionStandard: 'sae-j607', airTempC: 20, baroKpa: 99 })).toEqual(['humidityPct']);
    expect(fields({ correctionStandard: 'din-70020', airTempC: 20, baroKpa: 99 })).toEqual([]);
    expect(fields({ correctionStandard: 'none' })).toEqual([]);
  });
  it('names a missing reading together with every other problem', () => {
    expect(fields({ phase: 'sideways', baroKpa: 200, humidityPct: 40 }).sort()).toEqual([
      'airTempC',
      'baroKpa',
      'phase',
    ]);
  });
});
