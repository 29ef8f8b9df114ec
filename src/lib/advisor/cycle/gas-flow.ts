import { GAS_CONSTANT_J_PER_KG_K } from './constants';

// Heywood app. C: compressible quasi-steady flow through a restriction of effective area CdA.
// Subsonic: ṁ = CdA·p0/√(R·T0) · (pT/p0)^(1/γ) · √(2γ/(γ−1) · [1 − (pT/p0)^((γ−1)/γ)]);
// choked below the critical ratio (2/(γ+1))^(γ/(γ−1)): ṁ = CdA·p0/√(R·T0) · √γ · (2/(γ+1))^((γ+1)/(2(γ−1))).
export function orificeMassFlowKgPerS(
  effectiveAreaM2: number,
  upstreamPa: number,
  upstreamK: number,
  downstreamPa: number,
  gamma: number,
): number {
  if (effectiveAreaM2 <= 0 || upstreamPa <= downstreamPa) return 0;
  const k = chokeConstants(gamma);
  const lead = (effectiveAreaM2 * upstreamPa) / Math.sqrt(GAS_CONSTANT_J_PER_KG_K * upstreamK);
  const ratio = downstreamPa / upstreamPa;
  if (ratio <= k.criticalRatio) return lead * k.chokedFactor;
  // (pT/p0)^((γ−1)/γ) = (pT/p0) / (pT/p0)^(1/γ): one power instead of two (this runs millions of times).
  const r1 = Math.pow(ratio, 1 / gamma);
  return lead * r1 * Math.sqrt(Math.max(0, k.twoGammaOverGm1 * (1 - ratio / r1)));
}

type ChokeConstants = { gamma: number; criticalRatio: number; chokedFactor: number; twoGammaOverGm1: number };

function makeChokeConstants(gamma: number): ChokeConstants {
  return {
    gamma,
    criticalRatio: Math.pow(2 / (gamma + 1), gamma / (gamma - 1)),
    chokedFactor: Math.sqrt(gamma) * Math.pow(2 / (gamma + 1), (gamma + 1) / (2 * (gamma - 1))),
    twoGammaOverGm1: (2 * gamma) / (gamma - 1),
  };
}

// The γ-only terms, kept for the last two γ seen: calls alternate between fresh air flowing in (γ fixed)
// and cylinder gas flowing out (γ of its mixture), so one slot would be recomputed on nearly every call.
let chokeA: ChokeConstants = makeChokeConstants(1.4);
let chokeB: ChokeConstants = makeChokeConstants(1.35);
function chokeConstants(gamma: number): ChokeConstants {
  if (chokeA.gamma === gamma) return chokeA;
  if (chokeB.gamma !== gamma) {
    chokeB = chokeA;
    chokeA = makeChokeConstants(gamma);
    return chokeA;
  }
  const hit = chokeB;
  chokeB = chokeA;
  chokeA = hit;
  return hit;
}

/** Flow-bench test pressure, 28 inH2O in pascals (the trade's standard depression). */
export const BENCH_DEPRESSION_PA = 28 * 249.089;
/** Air density on the bench (standard air, kg/m³). */
export const BENCH_AIR_DENSITY_KG_M3 = 1.204;
/** 1 cfm in m³/s. */
export const M3S_PER_CFM = 0.000471947;

// Incompressible orifice (Heywood app. C, small pressure drop): Q = CdA·√(2Δp/ρ), solved for CdA.
export function benchEffectiveAreaM2(cfm: number): number {
  return (cfm * M3S_PER_CFM) / Math.sqrt((2 * BENCH_DEPRESSION_PA) / BENCH_AIR_DENSITY_KG_M3);
}

// Ideal gas: speed of sound c = √(γ·R·T).
export function speedOfSoundMPerS(gamma: number, temperatureK: number): number {
  return Math.sqrt(gamma * GAS_CONSTANT_J_PER_KG_K * temperatureK);
}
