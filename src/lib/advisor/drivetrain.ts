import type { BuildProfile } from '@/lib/schemas/build-profile';

/** 63,360 in per mile / (60 min per h · π) = 336.13 (arithmetic). */
export const CRUISE_RPM_CONSTANT = 336.13;

// Arithmetic (tyre revolutions per mile): rpm = mph · axle · gear · 336.13 / tyre diameter (in).
export function cruiseRpm(mph: number, axleRatio: number, gearRatio: number, tireDiameterIn: number): number {
  return (mph * axleRatio * gearRatio * CRUISE_RPM_CONSTANT) / tireDiameterIn;
}

/**
 * Launch rpm assumed for a manual when the interview did not record one. Our own choice, from
 * how such vehicles are commonly driven (no published source): gentle for daily and towing.
 */
export const DEFAULT_MANUAL_LAUNCH_RPM = { daily: 1800, towing: 1600, street: 2500, strip: 3500 } as const;

/** The rpm the engine is at when it first pulls hard: converter stall, or the manual's launch rpm. */
export function pullAwayRpm(build: BuildProfile): { rpm: number; source: 'stall' | 'launch' | 'default-launch' } {
  const d = build.drivetrain;
  if (d.transmission === 'automatic') return { rpm: d.stallRpm ?? 0, source: 'stall' };
  if (d.launchRpm !== undefined) return { rpm: d.launchRpm, source: 'launch' };
  return { rpm: DEFAULT_MANUAL_LAUNCH_RPM[build.use.primary], source: 'default-launch' };
}

/** Cruise rpm in top gear at the customer's cruise speed (converter locked, no slip). */
export function buildCruiseRpm(build: BuildProfile): number {
  const d = build.drivetrain;
  return cruiseRpm(build.use.cruiseMph, d.axleRatio, d.topGearRatio, d.tireDiameterIn);
}
