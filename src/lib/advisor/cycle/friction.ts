// Heywood ch. 13, friction mean effective pressure of SI engines at wide-open throttle (the Barnes-Moss
// form, from memory): fmep (kPa) = 97 + 15·(N/1000) + 5·(N/1000)², N in rev/min. Pumping is not in it:
// the cycle computes the pumping loop itself. Scaled by the fitted frictionScale (Heywood: ±20 % between engines).
export function frictionMeanEffectivePressurePa(rpm: number, frictionScale: number): number {
  const k = rpm / 1000;
  return frictionScale * (97 + 15 * k + 5 * k * k) * 1000;
}
