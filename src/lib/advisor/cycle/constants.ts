// Constants of the engine-cycle model. Each says where it comes from:
//  - "Heywood" = J. B. Heywood, Internal Combustion Engine Fundamentals, McGraw-Hill 1988 (chapter given);
//  - "SAE J1349" = the standard-air reference the trade corrects dyno results to;
//  - "from memory" = a textbook or trade value recalled, not looked up;
//  - "fitted" = one of the few physical constants fitted once to the fitting set in docs/advisor.md,
//    inside the published range given beside it. No per-engine or per-part factor exists anywhere.

/** Gas constant of air and of the burned mixture, J/(kg·K) (Heywood ch. 3; the burned value is within 2 %). */
export const GAS_CONSTANT_J_PER_KG_K = 287;

/** SAE J1349 standard air: 99 kPa dry-air pressure (≈ 100 kPa total) at 25 °C. Predictions are "corrected" figures. */
export const AMBIENT_PRESSURE_PA = 100_000;
export const AMBIENT_TEMPERATURE_K = 298.15;

/** Ratio of specific heats (Heywood ch. 4, from memory): fresh air 1.40, unburned mixture 1.35, burned gas 1.28. */
export const GAMMA_AIR = 1.4;
export const GAMMA_UNBURNED = 1.35;
export const GAMMA_BURNED = 1.28;

/** Charge heating between the air filter and the valve (Heywood ch. 6 reports 10–30 K; 15 K our pick). */
export const INTAKE_CHARGE_HEATING_K = 15;

/** Mean wall temperature for heat transfer (Heywood ch. 12: liner 400–450 K, head and piston hotter; 450 K our pick). */
export const WALL_TEMPERATURE_K = 450;

/** Wiebe burn shape (Heywood ch. 9: a = 5, m = 2 fit measured SI mass-burned curves). */
export const WIEBE_EFFICIENCY_A = 5;
export const WIEBE_FORM_M = 2;

/** MBT spark puts 50 % of the mass burned near 8–10° ATDC (Heywood ch. 9); 9° our pick. */
export const MBT_FIFTY_PERCENT_BURNED_ATDC_DEG = 9;

/** Fuels: lower heating value (MJ/kg) and stoichiometric air/fuel (Heywood app. D; E85 from memory). */
export const FUELS = {
  gasoline: { lhvMjPerKg: 44.0, stoichAfr: 14.6 },
  e85: { lhvMjPerKg: 29.2, stoichAfr: 9.8 },
} as const;

/** E85's antiknock quality as an equivalent pump octane (AKI), from memory (commonly quoted 100–105). */
export const E85_EQUIVALENT_AKI = 100;

/**
 * The physical constants fitted once (see docs/advisor.md, "Calibration"): each with its published range.
 * Fitted on the fitting set only; the held-out set was not looked at while choosing them.
 */
export type FittedConstants = {
  burnDurationDeg: number;
  combustionEfficiency: number;
  frictionScale: number;
  waveAttenuation: number;
};

export const FITTED: FittedConstants = {
  // Wiebe total burn angle (0–99 %), crank deg. Heywood ch. 9: Wiebe Δθ 50–90° at full load. Set at 60°, not fitted.
  burnDurationDeg: 60,
  // Combustion efficiency at the slightly rich power mixture, on the oxygen-limited heat release.
  // Heywood ch. 3–4: 0.90–0.98 for SI engines (lower when rich).
  combustionEfficiency: 0.9,
  // Scale on the SI friction correlation (Heywood ch. 13: engines scatter about ±30 % around it, from memory): 0.7–1.2.
  frictionScale: 0.7,
  // Pressure-wave amplitude kept per round trip in a runner or primary (friction, heat loss, non-linear
  // losses). From memory of measured decay in engine pipes (Heywood ch. 7 shows it): 0.5–0.9.
  waveAttenuation: 0.7,
};

/** Published ranges the fitted constants must stay inside (tests check this). */
export const FITTED_RANGES: Record<keyof typeof FITTED, { min: number; max: number }> = {
  burnDurationDeg: { min: 50, max: 90 },
  combustionEfficiency: { min: 0.9, max: 0.98 },
  frictionScale: { min: 0.7, max: 1.2 },
  waveAttenuation: { min: 0.5, max: 0.9 },
};

/** Crank-angle step of the cycle integration, degrees. */
export const CRANK_STEP_DEG = 1;

/** Inches to metres. */
export const M_PER_IN = 0.0254;
/** 1 psi in pascals. */
export const PA_PER_PSI = 6894.757;
/** 1 lb·ft in N·m. */
export const NM_PER_LBFT = 1.3558179;
