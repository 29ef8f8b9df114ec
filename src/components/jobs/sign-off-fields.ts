import { SAFE } from '@/lib/jobs/sign-off-limits';

// The sign-off's readings in the order a technician takes them, with the unit beside each and the
// usual limit (from memory; the cam and spring maker's figures come first). Shared by form and sheet.
export type ReadingKey =
  | 'ptvIntakeIn'
  | 'ptvExhaustIn'
  | 'springInstalledHeightIn'
  | 'springSeatPressureLb'
  | 'coilBindMarginIn'
  | 'pushrodLengthIn'
  | 'lifterPreloadIn';
const in3 = (n: number) => n.toFixed(3);

export const READINGS: { key: ReadingKey; label: string; unit: 'in' | 'lb'; usual: string; digits: number }[] = [
  {
    key: 'ptvIntakeIn',
    label: 'Piston-to-valve, intake',
    unit: 'in',
    usual: `at least ${in3(SAFE.ptvIntakeMinIn)} in`,
    digits: 3,
  },
  {
    key: 'ptvExhaustIn',
    label: 'Piston-to-valve, exhaust',
    unit: 'in',
    usual: `at least ${in3(SAFE.ptvExhaustMinIn)} in`,
    digits: 3,
  },
  {
    key: 'springInstalledHeightIn',
    label: 'Spring installed height',
    unit: 'in',
    usual: `${in3(SAFE.installedHeightMinIn)}–${in3(SAFE.installedHeightMaxIn)} in, or the spring maker’s figure`,
    digits: 3,
  },
  {
    key: 'springSeatPressureLb',
    label: 'Spring seat pressure',
    unit: 'lb',
    usual: `${SAFE.seatPressureMinLb}–${SAFE.seatPressureMaxLb} lb for hydraulic roller`,
    digits: 0,
  },
  {
    key: 'coilBindMarginIn',
    label: 'Coil-bind margin',
    unit: 'in',
    usual: `at least ${in3(SAFE.coilBindMinIn)} in`,
    digits: 3,
  },
  {
    key: 'pushrodLengthIn',
    label: 'Pushrod length',
    unit: 'in',
    usual: `measured with a checking pushrod (${in3(SAFE.pushrodMinIn)}–${in3(SAFE.pushrodMaxIn)} in)`,
    digits: 3,
  },
  {
    key: 'lifterPreloadIn',
    label: 'Lifter preload',
    unit: 'in',
    usual: `${in3(SAFE.preloadMinIn)}–${in3(SAFE.preloadMaxIn)} in for hydraulic lifters`,
    digits: 3,
  },
];
