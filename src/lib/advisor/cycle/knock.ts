// Knock, by the end-gas auto-ignition integral. Douaud & Eyzat (SAE 780080), as used in Heywood ch. 9:
// ignition delay τ (ms) = 17.68 · (ON/100)^3.402 · p(atm)^−1.7 · exp(3800 / T). Livengood–Wu: the end gas
// auto-ignites (knocks) when ∫ dt/τ reaches 1 before the flame has consumed it.
export function ignitionDelayMs(octaneNumber: number, pressurePa: number, temperatureK: number): number {
  return (
    17.68 * Math.exp(3.402 * Math.log(octaneNumber / 100) - 1.7 * Math.log(pressurePa / 101_325) + 3800 / temperatureK)
  );
}

// Isentropic compression of the unburned end gas (Heywood ch. 4): T = T_ref · (p / p_ref)^((γ−1)/γ).
export function endGasTemperatureK(refTempK: number, refPressurePa: number, pressurePa: number, gamma: number): number {
  return refTempK * Math.pow(pressurePa / refPressurePa, (gamma - 1) / gamma);
}

/**
 * Pump octane (AKI, the (R+M)/2 on the pump) to the research octane the correlation was fitted with:
 * RON ≈ AKI + 4.5 for typical pump gasoline (sensitivity about 9, common practice, from memory).
 */
export function researchOctaneFromAki(aki: number): number {
  return aki + 4.5;
}

/** The spark is retarded in steps of this many degrees until the end gas survives (our choice). */
export const KNOCK_RETARD_STEP_DEG = 2;
export const KNOCK_MAX_RETARD_DEG = 16;
