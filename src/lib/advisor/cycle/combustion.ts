import { MBT_FIFTY_PERCENT_BURNED_ATDC_DEG, WIEBE_EFFICIENCY_A, WIEBE_FORM_M } from './constants';

// Heywood ch. 9: Wiebe function, mass fraction burned x = 1 − exp(−a·((θ − θ₀)/Δθ)^(m+1)).
export function wiebeFractionBurned(crankDegFromStart: number, burnDurationDeg: number): number {
  if (crankDegFromStart <= 0) return 0;
  const x = crankDegFromStart / burnDurationDeg;
  return 1 - Math.exp(-WIEBE_EFFICIENCY_A * (WIEBE_FORM_M === 2 ? x * x * x : Math.pow(x, WIEBE_FORM_M + 1)));
}

// Heywood ch. 9, the Wiebe function solved for x = 0.5: θ₅₀ − θ₀ = Δθ·(ln 2 / a)^(1/(m+1)).
export function startOfBurnDegAtdc(burnDurationDeg: number, retardDeg: number): number {
  const toHalf = burnDurationDeg * Math.pow(Math.LN2 / WIEBE_EFFICIENCY_A, 1 / (WIEBE_FORM_M + 1));
  return MBT_FIFTY_PERCENT_BURNED_ATDC_DEG + retardDeg - toHalf;
}

// Heywood ch. 3–4: heat released by a rich-of-stoichiometric charge is oxygen-limited:
// Q = η_c · m_air · LHV / (A/F)_stoich.
export function chargeHeatJ(
  trappedAirKg: number,
  lhvMjPerKg: number,
  stoichAfr: number,
  combustionEfficiency: number,
): number {
  return (combustionEfficiency * trappedAirKg * lhvMjPerKg * 1e6) / stoichAfr;
}
