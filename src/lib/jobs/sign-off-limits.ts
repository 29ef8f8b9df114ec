// Warnings for the technician's sign-off. Every limit below is common shop practice recalled from
// memory, not a published source; the cam and spring maker's own figures always come first, and a
// reading outside these ranges is a prompt to check, not a verdict. Pure: used by the API and the page.

export type SignOffReadings = {
  ptvIntakeIn: number;
  ptvExhaustIn: number;
  springInstalledHeightIn: number;
  springSeatPressureLb: number;
  coilBindMarginIn: number;
  pushrodLengthIn: number;
  lifterPreloadIn: number;
  deactivationDeleteDone: boolean | null;
};
export type SignOffWarning = { field: keyof SignOffReadings; message: string };

/** Just the readings, from a stored sign-off or a request (the deactivation answer already settled). */
export function readingsOf(r: SignOffReadings): SignOffReadings {
  return {
    ptvIntakeIn: r.ptvIntakeIn,
    ptvExhaustIn: r.ptvExhaustIn,
    springInstalledHeightIn: r.springInstalledHeightIn,
    springSeatPressureLb: r.springSeatPressureLb,
    coilBindMarginIn: r.coilBindMarginIn,
    pushrodLengthIn: r.pushrodLengthIn,
    lifterPreloadIn: r.lifterPreloadIn,
    deactivationDeleteDone: r.deactivationDeleteDone,
  };
}

export const LIMITS_NOTE =
  'Limits are common practice from memory, not a published source. The cam and spring maker’s figures come first; local codes and licensed practice apply.';

// From memory: the usual minimum clearances with the cam degreed in, measured with light checking springs.
export const SAFE = {
  ptvIntakeMinIn: 0.08,
  ptvExhaustMinIn: 0.1,
  coilBindMinIn: 0.06,
  // From memory: typical hydraulic-roller seat pressure and installed height on pushrod V8 springs.
  seatPressureMinLb: 100,
  seatPressureMaxLb: 200,
  installedHeightMinIn: 1.7,
  installedHeightMaxIn: 1.9,
  // From memory: pushrod V8 pushrods run roughly 6.5–9.0 in; hydraulic lifter preload roughly 0.030–0.100 in.
  pushrodMinIn: 6.5,
  pushrodMaxIn: 9,
  preloadMinIn: 0.03,
  preloadMaxIn: 0.1,
} as const;

const in3 = (n: number) => `${n.toFixed(3)} in`;

export function signOffWarnings(r: SignOffReadings): SignOffWarning[] {
  const out: SignOffWarning[] = [];
  if (r.ptvIntakeIn < SAFE.ptvIntakeMinIn)
    out.push({
      field: 'ptvIntakeIn',
      message: `Intake piston-to-valve ${in3(r.ptvIntakeIn)} is under the usual ${in3(SAFE.ptvIntakeMinIn)} minimum.`,
    });
  if (r.ptvExhaustIn < SAFE.ptvExhaustMinIn)
    out.push({
      field: 'ptvExhaustIn',
      message: `Exhaust piston-to-valve ${in3(r.ptvExhaustIn)} is under the usual ${in3(SAFE.ptvExhaustMinIn)} minimum.`,
    });
  if (r.springInstalledHeightIn < SAFE.installedHeightMinIn || r.springInstalledHeightIn > SAFE.installedHeightMaxIn) {
    out.push({
      field: 'springInstalledHeightIn',
      message: `Installed height ${in3(r.springInstalledHeightIn)} is outside the usual ${in3(SAFE.installedHeightMinIn)}–${in3(SAFE.installedHeightMaxIn)}; set it to the spring maker’s figure.`,
    });
  }
  if (r.springSeatPressureLb < SAFE.seatPressureMinLb)
    out.push({
      field: 'springSeatPressureLb',
      message: `Seat pressure ${r.springSeatPressureLb} lb is under about ${SAFE.seatPressureMinLb} lb: risk of valve float with a hydraulic roller cam.`,
    });
  if (r.springSeatPressureLb > SAFE.seatPressureMaxLb)
    out.push({
      field: 'springSeatPressureLb',
      message: `Seat pressure ${r.springSeatPressureLb} lb is over about ${SAFE.seatPressureMaxLb} lb: hard on hydraulic roller lifters.`,
    });
  if (r.coilBindMarginIn < SAFE.coilBindMinIn)
    out.push({
      field: 'coilBindMarginIn',
      message: `Coil-bind margin ${in3(r.coilBindMarginIn)} is under the usual ${in3(SAFE.coilBindMinIn)} minimum.`,
    });
  if (r.pushrodLengthIn < SAFE.pushrodMinIn || r.pushrodLengthIn > SAFE.pushrodMaxIn) {
    out.push({
      field: 'pushrodLengthIn',
      message: `Pushrod length ${in3(r.pushrodLengthIn)} is outside the usual ${in3(SAFE.pushrodMinIn)}–${in3(SAFE.pushrodMaxIn)}; check it with a checking pushrod.`,
    });
  }
  if (r.lifterPreloadIn < SAFE.preloadMinIn || r.lifterPreloadIn > SAFE.preloadMaxIn) {
    out.push({
      field: 'lifterPreloadIn',
      message: `Lifter preload ${in3(r.lifterPreloadIn)} is outside the usual ${in3(SAFE.preloadMinIn)}–${in3(SAFE.preloadMaxIn)} for hydraulic lifters.`,
    });
  }
  if (r.deactivationDeleteDone === false) {
    out.push({
      field: 'deactivationDeleteDone',
      message:
        'Cylinder deactivation left in place: only with a cam made for deactivation lifters and a tune set for it.',
    });
  }
  return out;
}
