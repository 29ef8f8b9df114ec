// Where a dyno measures. A chassis dyno reads power at the wheels, after the gearbox, converter and axle
// have taken their share; an engine dyno reads it at the flywheel. The two differ by the driveline's loss,
// which no one figure covers, so a run is compared only with runs of its own kind.

export const DYNO_TYPES = ['chassis', 'engine'] as const;
export type DynoType = (typeof DYNO_TYPES)[number];

export const DYNO_TYPE_WORDS: Record<DynoType, { short: string; long: string }> = {
  chassis: { short: 'Chassis', long: 'Chassis dyno (power at the wheels)' },
  engine: { short: 'Engine', long: 'Engine dyno (power at the flywheel)' },
};
