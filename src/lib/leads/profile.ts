import { ENGINE_PRESETS } from '@/lib/builds/interview-values';
import { camCardOf } from '@/lib/catalogue/cam-card-of';
import type { BaselineCardOption } from '@/lib/builds/types';
import { BuildProfileSchema, type BuildProfile, type BuildProfileInput } from '@/lib/schemas/build-profile';
import type { LeadAnswers } from '@/lib/schemas/lead';

// From the customer's plain answers to a build profile the advisor can rank. The customer knows none
// of the figures, so every one is a DEFAULT, chosen to be conservative: when in doubt, assume the
// combination that favours the milder cam (stock compression, vacuum brakes, regular pump gas, the
// factory exhaust with its catalytic converters, emissions testing). The counter interview replaces
// all of it with the real figures before anything is quoted.

/** "Not sure" → the 5.3 L, the most common engine at the counter (with cylinder deactivation, the cautious case). */
const UNSURE_ENGINE_LITERS = 5.3;

// Vehicle and gearing defaults FROM MEMORY (typical, approximate, not from a published table):
// a full-size pickup for the truck-intake engines, a coupe for the car-intake engine.
const TRUCK = { weightLb: 5200, tireDiameterIn: 31, axleRatio: 3.42, changedAxleRatio: 3.73 } as const;
const CAR = { weightLb: 3600, tireDiameterIn: 26, axleRatio: 3.23, changedAxleRatio: 3.73 } as const;
// Overdrive top gear, from memory: about 0.70 for a four-speed automatic, about 0.62 for a six-speed manual.
const TOP_GEAR = { automatic: 0.7, manual: 0.62 } as const;
// Converter stall, from memory: about 2,000 rpm for a factory converter; a changed one is assumed to be a
// modest 2,800 rpm (a bigger guess would let the advisor pick a bigger cam than the car may suit).
const STALL_RPM = { stock: 2000, changed: 2800 } as const;
// Budget ranges → the top of each range in cents, so a cam is never ranked down for a budget the customer
// did not rule out. "Not sure" gives no budget at all (undefined; the schema stores 0, "none given") rather
// than a guessed range that would rank the dearer cams down for a limit the customer never set.
const BUDGET_CENTS: Record<LeadAnswers['budget'], number | undefined> = {
  'under-1500': 150_000,
  '1500-3000': 300_000,
  '3000-5000': 500_000,
  'over-5000': 800_000,
  unsure: undefined,
};

export function engineLiters(answers: Pick<LeadAnswers, 'engine'>): number {
  return answers.engine === 'unsure' ? UNSURE_ENGINE_LITERS : Number(answers.engine);
}

/** Builds the profile; null when the catalogue holds no stock cam card for that engine. */
export function buildProfileFromAnswers(
  answers: LeadAnswers,
  baselineCards: BaselineCardOption[],
): BuildProfile | null {
  const liters = engineLiters(answers);
  const preset = ENGINE_PRESETS.find((p) => p.liters === liters);
  const card = baselineCards.find((c) => c.baselineForLiters === liters);
  if (!preset || !card) return null;
  const vehicle = preset.intakeManifold === 'car' ? CAR : TRUCK;
  // "Not sure" about emissions is treated as yes.
  const emissionsRequired = answers.emissions !== 'no';
  const converterChanged = answers.driveline === 'converter' || answers.driveline === 'both';
  const gearsChanged = answers.driveline === 'gears' || answers.driveline === 'both';
  const exhaust: BuildProfileInput['exhaust'] =
    answers.exhaust === 'stock'
      ? { headers: 'manifold', system: 'full-with-cats' }
      : answers.exhaust === 'headers'
        ? // "Headers" without a type: assume shorty headers (the milder guess) with a full exhaust.
          { headers: 'shorty', system: emissionsRequired ? 'full-with-cats' : 'full' }
        : { headers: 'shorty', system: 'open-short' };
  const input: BuildProfileInput = {
    engine: {
      cylinders: 8,
      boreIn: preset.boreIn,
      strokeIn: preset.strokeIn,
      rodLengthIn: preset.rodLengthIn,
      compressionRatio: preset.compressionRatio,
      headMaterial: preset.headMaterial,
      intakeFlowCfm: preset.intakeFlowCfm,
      intakeManifold: preset.intakeManifold,
      cylinderDeactivation: preset.cylinderDeactivation,
    },
    exhaust,
    drivetrain: {
      transmission: answers.transmission,
      ...(answers.transmission === 'automatic'
        ? { stallRpm: converterChanged ? STALL_RPM.changed : STALL_RPM.stock }
        : { stallRpm: 0 }),
      axleRatio: gearsChanged ? vehicle.changedAxleRatio : vehicle.axleRatio,
      topGearRatio: TOP_GEAR[answers.transmission],
      tireDiameterIn: vehicle.tireDiameterIn,
    },
    // Vacuum brakes: the case where a lumpy idle costs brake assist, so the advisor keeps it in view.
    vehicle: {
      weightLb: vehicle.weightLb,
      powerBrakes: 'vacuum',
      ...(answers.vehicle ? { class: answers.vehicle } : {}),
    },
    use: {
      primary: answers.use,
      idle: answers.idle,
      fuelOctane: 87, // regular pump gas
      emissionsRequired,
      cruiseMph: 65,
      budgetCents: BUDGET_CENTS[answers.budget],
    },
    baselineCam: camCardOf(card),
  };
  const parsed = BuildProfileSchema.safeParse(input);
  return parsed.success ? parsed.data : null;
}
