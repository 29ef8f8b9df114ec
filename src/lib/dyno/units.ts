import { KPA_PER_INHG } from './correction';

// Air readings as the shop reads them. Stored and sent to the API in °C and kPa always; the form and
// the run table convert at the edge. Pure.

/** The shop's choice (shop_settings.dyno_air_units); 'imperial' is the default, as in the rest of the product. */
export const AIR_UNITS = ['imperial', 'metric'] as const;
export type AirUnits = (typeof AIR_UNITS)[number];

export const AIR_UNIT_TEXT: Record<AirUnits, { temp: string; baro: string }> = {
  imperial: { temp: '°F', baro: 'inHg' },
  metric: { temp: '°C', baro: 'kPa' },
};

/** The settings page's choice, in words. */
export const AIR_UNITS_WORDS: Record<AirUnits, string> = {
  imperial: '°F and inHg',
  metric: '°C and kPa',
};

export const fahrenheitFromCelsius = (c: number) => (c * 9) / 5 + 32;
export const celsiusFromFahrenheit = (f: number) => ((f - 32) * 5) / 9;
export const inHgFromKpa = (kpa: number) => kpa / KPA_PER_INHG;
export const kpaFromInHg = (inHg: number) => inHg * KPA_PER_INHG;

/** Decimals worth showing and typing: a whole °F is finer than 0.1 °C; 0.01 inHg is finer than 0.1 kPa. */
export const AIR_DIGITS: Record<AirUnits, { temp: number; baro: number }> = {
  imperial: { temp: 0, baro: 2 },
  metric: { temp: 1, baro: 1 },
};

export function tempIn(units: AirUnits, celsius: number): number {
  return units === 'imperial' ? fahrenheitFromCelsius(celsius) : celsius;
}
export function tempToCelsius(units: AirUnits, value: number): number {
  return units === 'imperial' ? celsiusFromFahrenheit(value) : value;
}
export function baroIn(units: AirUnits, kpa: number): number {
  return units === 'imperial' ? inHgFromKpa(kpa) : kpa;
}
export function baroToKpa(units: AirUnits, value: number): number {
  return units === 'imperial' ? kpaFromInHg(value) : value;
}

/** Rounds to a number of decimals without float noise (29.530000000000001 → 29.53). */
export function roundTo(value: number, digits: number): number {
  return Number(value.toFixed(digits));
}

/**
 * An SI range in the shop's units, rounded inwards to the digits shown, so any value inside the shown
 * range still lies inside the SI range once converted (70 kPa = 20.671 inHg → from 20.68 inHg).
 */
export function rangeIn(
  units: AirUnits,
  kind: 'temp' | 'baro',
  si: { min: number; max: number },
): { min: number; max: number } {
  const digits = AIR_DIGITS[units][kind];
  const convert = kind === 'temp' ? tempIn : baroIn;
  const scale = 10 ** digits;
  return {
    min: Math.ceil(roundTo(convert(units, si.min) * scale, 6)) / scale,
    max: Math.floor(roundTo(convert(units, si.max) * scale, 6)) / scale,
  };
}
