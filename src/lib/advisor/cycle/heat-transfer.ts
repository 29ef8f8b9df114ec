// Heywood ch. 12, Woschni's correlation: h = 3.26 · B^−0.2 · p^0.8 · T^−0.55 · w^0.8 (W/m²K; B in m,
// p in kPa, T in K), with the characteristic gas speed w = C₁·S̄p + C₂·(Vd·T_r/(p_r·V_r))·(p − p_motored).
export function woschniCoefficientWPerM2K(
  boreM: number,
  pressurePa: number,
  temperatureK: number,
  gasSpeedMPerS: number,
): number {
  // The same powers through one exponential (this runs on every crank step).
  const lnTerms =
    0.8 * Math.log((pressurePa / 1000) * Math.max(0.1, gasSpeedMPerS)) -
    0.55 * Math.log(temperatureK) -
    0.2 * Math.log(boreM);
  return 3.26 * Math.exp(lnTerms);
}

/** Woschni's constants (Heywood ch. 12): C₁ = 6.18 during gas exchange, 2.28 otherwise; C₂ = 3.24·10⁻³ m/(s·K) while burning and expanding. */
export const WOSCHNI = { c1GasExchange: 6.18, c1Closed: 2.28, c2Combustion: 3.24e-3 } as const;

// Heywood ch. 12: Woschni's characteristic gas speed.
export function woschniGasSpeedMPerS(
  c1: number,
  meanPistonSpeedMPerS: number,
  c2: number,
  sweptM3: number,
  refTempK: number,
  refPressurePa: number,
  refVolumeM3: number,
  pressurePa: number,
  motoredPa: number,
): number {
  const combustion =
    c2 > 0 ? c2 * ((sweptM3 * refTempK) / (refPressurePa * refVolumeM3)) * Math.max(0, pressurePa - motoredPa) : 0;
  return c1 * meanPistonSpeedMPerS + combustion;
}
