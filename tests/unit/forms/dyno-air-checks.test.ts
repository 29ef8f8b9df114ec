import { airInSi, dynoAirChecks } from '@/lib/forms/dyno-air-checks';
import type { AirUnits } from '@/lib/dyno/units';
import { DynoRunSchema } from '@/lib/schemas/dyno-run';
import { zodErrors } from '../../support/zod-errors';

// The dyno form's air boxes, checked by yup in the units of the shop's setting, against the zod schema
// POST /api/dyno-runs uses on the same readings once converted to °C and kPa (airInSi). Both must flag the
// same readings; in °C and kPa they say the same words, in °F and inHg the same words with the unit on screen.

const pull = [
  { rpm: 3000, torqueLbFt: 360 },
  { rpm: 3500, torqueLbFt: 375 },
  { rpm: 4000, torqueLbFt: 380 },
];
const SI_NAME: Record<string, string> = { airTemp: 'airTempC', baro: 'baroKpa', humidityPct: 'humidityPct' };

type Typed = { correctionStandard: string; airTemp: number | ''; baro: number | ''; humidityPct: number | '' };

/** Both verdicts on one set of typed boxes, yup's renamed to the API's field names. */
function verdicts(units: AirUnits, typed: Typed) {
  const browser = Object.fromEntries(
    Object.entries(dynoAirChecks(units)(typed)).map(([box, message]) => [SI_NAME[box], message]),
  );
  const payload = { buildId: 1, phase: 'before', curve: pull, correctionStandard: typed.correctionStandard };
  const server = zodErrors(DynoRunSchema, { ...payload, ...airInSi(typed, units) });
  return { browser, server };
}

const j1349 = (airTemp: number | '', baro: number | '', humidityPct: number | ''): Typed => ({
  correctionStandard: 'sae-j1349',
  airTemp,
  baro,
  humidityPct,
});

describe('dyno air checks: yup in the shop’s units, zod in °C and kPa', () => {
  it('converts typed °F and inHg to °C and kPa, and passes °C and kPa through', () => {
    const si = airInSi({ airTemp: 77, baro: 29.53, humidityPct: 40 }, 'imperial');
    expect(si.airTempC).toBeCloseTo(25, 10);
    expect(si.baroKpa).toBeCloseTo(100.0, 1);
    expect(si.humidityPct).toBe(40);
    expect(airInSi({ airTemp: 25, baro: 100, humidityPct: '' }, 'metric')).toEqual({
      airTempC: 25,
      baroKpa: 100,
      humidityPct: undefined,
    });
  });

  const metricCases: [string, Typed, string[]][] = [
    ['a sensible day', j1349(21.5, 99.8, 45), []],
    ['everything missing for SAE J1349', j1349('', '', ''), ['airTempC', 'baroKpa', 'humidityPct']],
    ['a reading past each limit', j1349(61, 69.9, 101), ['airTempC', 'baroKpa', 'humidityPct']],
    ['pressure typed in inHg by mistake', j1349(20, 29.9, 40), ['baroKpa']],
    ['DIN 70020 without humidity', { correctionStandard: 'din-70020', airTemp: 20, baro: 101.3, humidityPct: '' }, []],
    ['no correction and no air', { correctionStandard: 'none', airTemp: '', baro: '', humidityPct: '' }, []],
  ];
  it.each(metricCases)('°C and kPa, %s: the same fields, in the same words', (_name, typed, flagged) => {
    const { browser, server } = verdicts('metric', typed);
    expect(Object.keys(server).sort()).toEqual([...flagged].sort());
    expect(browser).toEqual(server);
  });

  const imperialCases: [string, Typed, string[]][] = [
    ['a sensible day', j1349(68, 29.47, 45), []],
    ['everything missing for SAE J1349', j1349('', '', ''), ['airTempC', 'baroKpa', 'humidityPct']],
    ['a reading past each limit', j1349(141, 20.6, -1), ['airTempC', 'baroKpa', 'humidityPct']],
    ['pressure typed in kPa by mistake', j1349(68, 99.5, 40), ['baroKpa']],
    ['a temperature typed in °C that is too cold in °F', j1349(-10, 29.92, 40), ['airTempC']],
  ];
  it.each(imperialCases)('°F and inHg, %s: the same fields, the unit on screen', (_name, typed, flagged) => {
    const { browser, server } = verdicts('imperial', typed);
    expect(Object.keys(server).sort()).toEqual([...flagged].sort());
    expect(Object.keys(browser).sort()).toEqual([...flagged].sort());
    for (const field of flagged) {
      // Same opening words; the browser names °F or inHg where the server names °C or kPa.
      expect(browser[field].split(' ').slice(0, 3)).toEqual(server[field].split(' ').slice(0, 3));
      if (field === 'airTempC') expect(browser[field]).toMatch(/°F\)?$/);
      if (field === 'baroKpa') expect(browser[field]).toMatch(/inHg\)?$/);
    }
  });

  it('names the typed limit in °F and inHg, rounded inwards so nothing it lets through fails on the server', () => {
    expect(dynoAirChecks('imperial')(j1349(150, 29.92, 40))).toEqual({
      airTemp: 'air temperature must be at most 140 °F',
    });
    expect(dynoAirChecks('imperial')(j1349(68, 20.67, 40))).toEqual({
      baro: 'barometric pressure must be at least 20.68 inHg',
    });
    // 20.68 inHg is the lowest the browser takes: 70.03 kPa, inside the server's 70 kPa.
    expect(verdicts('imperial', j1349(68, 20.68, 40))).toEqual({ browser: {}, server: {} });
  });
});
