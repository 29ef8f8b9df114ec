import type { BuildProfile } from '@/lib/schemas/build-profile';
import type { CamCard } from '@/lib/schemas/cam-card';
import type { ConverterDetail, FitDetail } from './scoring';
import type { Need, NeedKind } from './types';
import { groupThousands, inches } from './format';

/** Every need kind, in the order a job sheet lists them (the rules page and the forms read this list). */
export const NEED_KIND_LIST = [
  'install',
  'springs',
  'pushrods',
  'lifters',
  'deactivation-delete',
  'converter',
  'tune',
] as const satisfies readonly NeedKind[];

// Common practice, values from memory (no published source): past about 0.580" of lift the heavier
// springs load the pushrods enough that hardened ones go in; past about 0.600" a stock hydraulic
// valvetrain gets lifters made for the lift and the spring load. The delete kit brings its own lifters.
export const NEED_LIFT_THRESHOLDS = { pushrodsFromIn: 0.58, liftersFromIn: 0.6 } as const;

// Whether springs rated to ratedMaxLiftIn carry a cam with this valve lift: the one rule for the installed
// springs (scoring.ts: springs are needed when they do not) and for the catalogue's kits the quote picks
// (src/lib/catalogue/spring-kits.ts). Rated to the lift is enough; the tolerance only absorbs float noise.
export function springsCoverLift(ratedMaxLiftIn: number, liftIn: number): boolean {
  return liftIn <= ratedMaxLiftIn + 1e-9;
}

// What the cam requires, structured so the catalogue's rules can map each kind to parts and labour.
// The advisor alone decides whether a kind is needed; the rules only say what it costs in this shop.
export function camNeeds(fit: FitDetail, converter: ConverterDetail, build?: BuildProfile, cam?: CamCard): Need[] {
  // Every cam swap is fitted: the rules price the labour by vehicle class.
  const needs: Need[] = [
    { kind: 'install', reason: 'Fitting the cam: the front of the engine comes apart and the lifters are inspected.' },
  ];
  if (fit.springsNeeded) {
    needs.push({
      kind: 'springs',
      reason: `Lift ${inches(fit.maxLiftIn)} exceeds the installed springs' ${inches(fit.springLimitIn)} limit${fit.springLimitAssumed ? ' (assumed from the current cam)' : ''}.`,
      minLiftIn: fit.maxLiftIn,
    });
  }
  const rockerChange =
    build !== undefined && cam !== undefined && Math.abs(cam.rockerRatio - build.baselineCam.rockerRatio) > 1e-9;
  if (fit.maxLiftIn >= NEED_LIFT_THRESHOLDS.pushrodsFromIn || rockerChange) {
    needs.push({
      kind: 'pushrods',
      reason: rockerChange
        ? `The cam is specified with ${cam!.rockerRatio}:1 rockers against ${build!.baselineCam.rockerRatio}:1 now, so the pushrod length changes.`
        : `Lift ${inches(fit.maxLiftIn)} is at or past ${inches(NEED_LIFT_THRESHOLDS.pushrodsFromIn)}: hardened pushrods for the heavier spring load.`,
    });
  }
  const stockValvetrain = (build?.engine.valvetrain ?? 'stock-hydraulic') === 'stock-hydraulic';
  if (fit.maxLiftIn >= NEED_LIFT_THRESHOLDS.liftersFromIn && stockValvetrain && !fit.deleteNeeded) {
    needs.push({
      kind: 'lifters',
      reason: `Lift ${inches(fit.maxLiftIn)} is at or past ${inches(NEED_LIFT_THRESHOLDS.liftersFromIn)} on a stock hydraulic valvetrain: lifters made for it.`,
    });
  }
  if (fit.deleteNeeded) {
    needs.push({
      kind: 'deactivation-delete',
      reason: 'The engine has active cylinder deactivation and this cam is not listed as compatible.',
    });
  }
  if (converter.suggestedStallRpm !== null && converter.crossoverRpm !== null) {
    needs.push({
      kind: 'converter',
      reason: `The cam starts to pull at about ${groupThousands(Math.round(converter.crossoverRpm / 100) * 100)} rpm, well above the ${groupThousands(converter.pullAwayRpm)} rpm stall.`,
      suggestedStallRpm: converter.suggestedStallRpm,
    });
  }
  // Every cam swap changes airflow and idle: the engine must be re-tuned.
  needs.push({ kind: 'tune', reason: 'Every cam swap needs the engine re-tuned for the new airflow and idle.' });
  return needs;
}
