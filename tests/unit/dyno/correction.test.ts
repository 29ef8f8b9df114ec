import {
  correctionFor,
  din70020Factor,
  dryAirPressureKpa,
  KPA_PER_INHG,
  saeJ1349Factor,
  saeJ607Factor,
  saturationVapourPressureKpa,
} from '@/lib/dyno/correction';

describe('saturation vapour pressure (Magnus formula, Alduchov & Eskridge 1996)', () => {
  it('is 0.61094 kPa at 0 °C, the formula’s constant (exp(0) = 1)', () => {
    expect(saturationVapourPressureKpa(0)).toBeCloseTo(0.61094, 5);
  });
  it('is about 3.17 kPa at 25 °C and 4.24 kPa at 30 °C (steam tables give 3.17 and 4.25 kPa; from memory)', () => {
    // 25 °C: 0.61094 · exp(17.625·25 / 268.04) = 0.61094 · exp(1.64386) = 0.61094 · 5.1752 = 3.1617 kPa
    expect(saturationVapourPressureKpa(25)).toBeCloseTo(3.1617, 3);
    // 30 °C: 0.61094 · exp(17.625·30 / 273.04) = 0.61094 · exp(1.93653) = 0.61094 · 6.9346 = 4.2367 kPa
    expect(saturationVapourPressureKpa(30)).toBeCloseTo(4.2367, 3);
  });
  it('dry-air pressure takes off RH · es (Dalton’s law): 98 kPa, 30 °C, 50 % → 98 − 0.5 · 4.2367 = 95.8817 kPa', () => {
    expect(dryAirPressureKpa(98, 30, 50)).toBeCloseTo(95.8817, 3);
    expect(dryAirPressureKpa(98, 30, 0)).toBe(98);
  });
});

describe('SAE J1349: cf = 1.18 · (99/Pd) · √((T+273)/298) − 0.18', () => {
  it('is exactly 1 at its reference state, 99 kPa dry air and 25 °C (by definition: 1.18 · 1 · 1 − 0.18)', () => {
    expect(saeJ1349Factor(99, 25)).toBeCloseTo(1, 12);
    // The same through the whole path: dry air (0 % humidity) at 99 kPa and 25 °C.
    expect(correctionFor('sae-j1349', { baroKpa: 99, airTempC: 25, humidityPct: 0 }).factor).toBeCloseTo(1, 12);
  });
  it('hand-worked: 98 kPa, 30 °C, 50 % humidity', () => {
    // Pd = 98 − 0.5 · 4.23665 = 95.88167 kPa
    // 99 / 95.88167 = 1.032523; √(303 / 298) = √1.016779 = 1.008354
    // cf = 1.18 · 1.032523 · 1.008354 − 0.18 = 1.228555 − 0.18 = 1.048555
    const c = correctionFor('sae-j1349', { baroKpa: 98, airTempC: 30, humidityPct: 50 });
    expect(c.pressureKpa).toBeCloseTo(95.8817, 3);
    expect(c.factor).toBeCloseTo(1.048555, 5);
    expect(c.source).toMatch(/SAE J1349/);
  });
  it('corrects down on a cold, dense day: 101 kPa dry, 10 °C', () => {
    // 99/101 = 0.980198; √(283/298) = √0.949664 = 0.974507; 1.18 · 0.980198 · 0.974507 − 0.18 = 1.127143 − 0.18 = 0.947143
    expect(saeJ1349Factor(101, 10)).toBeCloseTo(0.947143, 5);
  });
});

describe('SAE J607 (from memory): cf = (29.92/Pd inHg) · √((T°F+460)/520)', () => {
  it('is 1 at its reference state, 29.92 inHg dry and 60 °F (15.556 °C)', () => {
    expect(saeJ607Factor(29.92 * KPA_PER_INHG, ((60 - 32) * 5) / 9)).toBeCloseTo(1, 12);
  });
  it('hand-worked: 98 kPa, 30 °C (86 °F), 50 % humidity', () => {
    // Pd = 95.88167 kPa = 95.88167 / 3.386389 = 28.31384 inHg; 29.92 / 28.31384 = 1.056727
    // √((86 + 460) / 520) = √1.05 = 1.024695; cf = 1.056727 · 1.024695 = 1.082823
    expect(correctionFor('sae-j607', { baroKpa: 98, airTempC: 30, humidityPct: 50 }).factor).toBeCloseTo(1.082823, 5);
  });
});

describe('DIN 70020 (from memory): cf = (1013/p mbar) · √((273+t)/293)', () => {
  it('is 1 at its reference state, 1013 mbar and 20 °C', () => {
    expect(din70020Factor(101.3, 20)).toBeCloseTo(1, 12);
  });
  it('hand-worked: 980 mbar, 30 °C; humidity is not part of it', () => {
    // 1013 / 980 = 1.033673; √(303 / 293) = √1.034130 = 1.016922; cf = 1.033673 · 1.016922 = 1.051165
    expect(correctionFor('din-70020', { baroKpa: 98, airTempC: 30, humidityPct: 50 }).factor).toBeCloseTo(1.051165, 5);
    expect(correctionFor('din-70020', { baroKpa: 98, airTempC: 30, humidityPct: 0 }).factor).toBeCloseTo(1.051165, 5);
  });
});

describe('no correction', () => {
  it('leaves the observed figures as they are', () => {
    expect(correctionFor('none', { baroKpa: 90, airTempC: 40, humidityPct: 80 }).factor).toBe(1);
  });
});
