import { SAFE } from '@/lib/jobs/sign-off-limits';
import { SIGN_OFF_READING_LIMITS as R } from '@/lib/schemas/job';

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
/** The schema's name for a reading, as a label: "coil-bind margin" → "Coil-bind margin". */
const sentence = (words: string) => words[0].toUpperCase() + words.slice(1);

export const READINGS: { key: ReadingKey; label: string; unit: 'in' | 'lb'; usual: string; digits: number }[] = [
  {
    key: 'ptvIntakeIn',
    label: sentence(R.ptvIntakeIn.label),
    unit: 'in',
    usual: `at least ${in3(SAFE.ptvIntakeMinIn)} in`,
    digits: 3,
  },
  {
    key: 'ptvExhaustIn',
    label: sentence(R.ptvExhaustIn.label),
    unit: 'in',
    usual: `at least ${in3(SAFE.ptvExhaustMinIn)} in`,
    digits: 3,
  },
  {
    key: 'springInstalledHeightIn',
    label: sentence(R.springInstalledHeightIn.label),
    unit: 'in',
    usual: `${in3(SAFE.installedHeightMinIn)}–${in3(SAFE.installedHeightMaxIn)} in, or the spring maker’s figure`,
    digits: 3,
  },
  {
    key: 'springSeatPressureLb',
    label: sentence(R.springSeatPressureLb.label),
    unit: 'lb',
    usual: `${SAFE.seatPressureMinLb}–${SAFE.seatPressureMaxLb} lb for hydraulic roller`,
    digits: 0,
  },
  {
    key: 'coilBindMarginIn',
    label: sentence(R.coilBindMarginIn.label),
    unit: 'in',
    usual: `at least ${in3(SAFE.coilBindMinIn)} in`,
    digits: 3,
  },
  {
    key: 'pushrodLengthIn',
    label: sentence(R.pushrodLengthIn.label),
    unit: 'in',
    usual: `measured with a checking pushrod (${in3(SAFE.pushrodMinIn)}–${in3(SAFE.pushrodMaxIn)} in)`,
    digits: 3,
  },
  {
    key: 'lifterPreloadIn',
    label: sentence(R.lifterPreloadIn.label),
    unit: 'in',
    usual: `${in3(SAFE.preloadMinIn)}–${in3(SAFE.preloadMaxIn)} in for hydraulic lifters`,
    digits: 3,
  },
];
