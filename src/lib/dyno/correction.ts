// Dyno correction to standard air: what the engine would have made on a standard day. Pure module
// (no database, React or Next). Corrected figure = observed figure × factor, for torque and power alike.

export const CORRECTION_STANDARD_NAMES = ['sae-j1349', 'sae-j607', 'din-70020', 'none'] as const;
export type CorrectionStandard = (typeof CORRECTION_STANDARD_NAMES)[number];
export type AirReading = { airTempC: number; baroKpa: number; humidityPct: number };

/** The readings each standard's formula uses (below); the others may be left out. */
export const AIR_NEEDED_BY: Record<CorrectionStandard, readonly (keyof AirReading)[]> = {
  'sae-j1349': ['airTempC', 'baroKpa', 'humidityPct'],
  'sae-j607': ['airTempC', 'baroKpa', 'humidityPct'],
  'din-70020': ['airTempC', 'baroKpa'],
  none: [],
};

export const STANDARD_LABELS: Record<CorrectionStandard, string> = {
  'sae-j1349': 'SAE J1349',
  'sae-j607': 'SAE J607',
  'din-70020': 'DIN 70020',
  none: 'no correction',
};

/** 1 inHg = 3.386389 kPa (mercury at 0 °C, standard gravity). */
export const KPA_PER_INHG = 3.386389;

// Magnus-type formula, Alduchov & Eskridge (1996) coefficients: es = 0.61094 · exp(17.625·T / (T + 243.04)) kPa, T in °C.
export function saturationVapourPressureKpa(tempC: number): number {
  return 0.61094 * Math.exp((17.625 * tempC) / (tempC + 243.04));
}

// Dalton's law of partial pressures: dry-air pressure = barometric − water-vapour partial pressure (RH/100 · es).
export function dryAirPressureKpa(baroKpa: number, tempC: number, humidityPct: number): number {
  return baroKpa - (humidityPct / 100) * saturationVapourPressureKpa(tempC);
}

// SAE J1349: cf = 1.18 · (99 / Pd) · √((T + 273) / 298) − 0.18; Pd dry-air pressure in kPa, T in °C (reference 99 kPa dry, 25 °C).
export function saeJ1349Factor(dryKpa: number, tempC: number): number {
  return 1.18 * (99 / dryKpa) * Math.sqrt((tempC + 273) / 298) - 0.18;
}

// SAE J607 (small engines; from memory): cf = (29.92 / Pd) · √((T + 460) / 520); Pd dry-air pressure in inHg, T in °F (60 °F, 29.92 inHg dry).
export function saeJ607Factor(dryKpa: number, tempC: number): number {
  const dryInHg = dryKpa / KPA_PER_INHG;
  const tempF = (tempC * 9) / 5 + 32;
  return (29.92 / dryInHg) * Math.sqrt((tempF + 460) / 520);
}

// DIN 70020 (from memory): cf = (1013 / p) · √((273 + t) / 293); p total barometric pressure in mbar, t in °C (1013 mbar, 20 °C).
export function din70020Factor(baroKpa: number, tempC: number): number {
  const mbar = baroKpa * 10;
  return (1013 / mbar) * Math.sqrt((273 + tempC) / 293);
}

export type Correction = {
  standard: CorrectionStandard;
  factor: number;
  /** The pressure the formula used, kPa: dry-air for the SAE standards, total barometric for DIN, null for none. */
  pressureKpa: number | null;
  formula: string;
  source: string;
};

export const CORRECTION_TEXT: Record<CorrectionStandard, { formula: string; source: string }> = {
  'sae-j1349': {
    formula:
      'cf = 1.18 · (99 / Pd) · √((T + 273) / 298) − 0.18; Pd = barometric − RH · es(T), es by the Magnus formula',
    source: 'SAE J1349 (reference 99 kPa dry air, 25 °C); vapour pressure: Magnus formula, Alduchov & Eskridge (1996)',
  },
  'sae-j607': {
    formula: 'cf = (29.92 / Pd inHg) · √((T °F + 460) / 520); Pd = barometric − RH · es(T)',
    source: 'SAE J607 (reference 60 °F, 29.92 inHg dry air), from memory',
  },
  'din-70020': {
    formula: 'cf = (1013 / p mbar) · √((273 + t) / 293); p total barometric pressure',
    source: 'DIN 70020 (reference 1013 mbar, 20 °C), from memory',
  },
  none: { formula: 'cf = 1 (observed figures, uncorrected)', source: 'no correction' },
};

/** The factor for one run's air, by the standard the shop chose. */
export function correctionFor(standard: CorrectionStandard, air: AirReading): Correction {
  const text = CORRECTION_TEXT[standard];
  switch (standard) {
    case 'sae-j1349': {
      const dry = dryAirPressureKpa(air.baroKpa, air.airTempC, air.humidityPct);
      return { standard, factor: saeJ1349Factor(dry, air.airTempC), pressureKpa: dry, ...text };
    }
    case 'sae-j607': {
      const dry = dryAirPressureKpa(air.baroKpa, air.airTempC, air.humidityPct);
      return { standard, factor: saeJ607Factor(dry, air.airTempC), pressureKpa: dry, ...text };
    }
    case 'din-70020':
      return { standard, factor: din70020Factor(air.baroKpa, air.airTempC), pressureKpa: air.baroKpa, ...text };
    case 'none':
      return { standard, factor: 1, pressureKpa: null, ...text };
  }
}
