import type { BaselineCardOption } from '@/lib/builds/types';
import { buildProfileFromAnswers } from '@/lib/leads/profile';
import { answersInWords, CHOICE_QUESTIONS } from '@/lib/leads/questions';
import { fromPrice } from '@/lib/leads/shortlist';
import { vehicleClassOf } from '@/lib/schemas/build-profile';
import { ENGINE_CHOICES, LeadAnswersSchema, type LeadAnswers } from '@/lib/schemas/lead';

// The questionnaire's answers → a conservative build profile. The defaults are our own choices and
// figures from memory (see src/lib/leads/profile.ts); these tests pin the direction of each choice.
const card = (liters: number, id: number): BaselineCardOption => ({
  id,
  sku: `FB-${id}`,
  name: `Stock card ${liters} L`,
  baselineForLiters: liters,
  intakeDuration050: 190,
  exhaustDuration050: 191,
  intakeAdvertised: null,
  exhaustAdvertised: null,
  intakeLiftIn: 0.467,
  exhaustLiftIn: 0.479,
  lsa: 114.5,
  intakeCenterline: 114.5,
  rockerRatio: 1.7,
  springMaxLiftIn: 0.5,
});
const CARDS = [4.8, 5.3, 5.7, 6.0, 6.2].map((l, i) => card(l, i + 1));
const base: LeadAnswers = {
  engine: '5.3',
  use: 'daily',
  idle: 'smooth',
  emissions: 'yes',
  transmission: 'automatic',
  driveline: 'stock',
  exhaust: 'stock',
  budget: '1500-3000',
  name: 'Test Customer',
  email: 'test@example.com',
  phone: undefined,
  consent: true,
};
const build = (change: Partial<LeadAnswers>) => buildProfileFromAnswers({ ...base, ...change }, CARDS)!;

describe('buildProfileFromAnswers', () => {
  it.each(ENGINE_CHOICES)('makes a valid profile for engine choice %s, with that engine’s stock cam card', (engine) => {
    const profile = build({ engine });
    expect(profile).not.toBeNull();
    const liters = engine === 'unsure' ? 5.3 : Number(engine);
    expect(profile.baselineCam.id).toBe(CARDS.find((c) => c.baselineForLiters === liters)!.id);
    expect(profile.engine.cylinders).toBe(8);
  });

  it('gives no budget for "not sure yet" (0, the schema’s "none given"), and the top of the range otherwise', () => {
    expect(build({ budget: 'unsure' }).use.budgetCents).toBe(0);
    expect(build({ budget: 'under-1500' }).use.budgetCents).toBe(150_000);
    expect(build({ budget: '3000-5000' }).use.budgetCents).toBe(500_000);
  });

  it('carries the kind of vehicle into the profile; answers saved before the question read with the default', () => {
    for (const vehicle of ['truck', 'suv', 'van', 'car'] as const)
      expect(build({ vehicle }).vehicle.class).toBe(vehicle);
    const older = build({});
    expect(older.vehicle.class).toBeUndefined();
    expect(vehicleClassOf(older)).toBe('truck'); // the 5.3 L's truck intake
    expect(vehicleClassOf(build({ engine: '5.7' }))).toBe('car');
    expect(LeadAnswersSchema.safeParse({ ...base, vehicle: 'boat' }).error?.issues[0].path).toEqual(['vehicle']);
  });

  it('treats "not sure" about emissions as a yes, and keeps the catalytic converters with stock exhaust', () => {
    expect(build({ emissions: 'unsure' }).use.emissionsRequired).toBe(true);
    expect(build({ emissions: 'no' }).use.emissionsRequired).toBe(false);
    expect(build({ exhaust: 'stock' }).exhaust).toEqual({ headers: 'manifold', system: 'full-with-cats' });
  });

  it('assumes the milder case where the customer cannot know: shorty headers, a modest changed stall, vacuum brakes, regular fuel', () => {
    expect(build({ exhaust: 'headers', emissions: 'no' }).exhaust).toMatchObject({ headers: 'shorty', system: 'full' });
    expect(build({ exhaust: 'open' }).exhaust).toMatchObject({ system: 'open-short' });
    expect(build({ driveline: 'stock' }).drivetrain.stallRpm).toBe(2000);
    expect(build({ driveline: 'converter' }).drivetrain.stallRpm).toBe(2800);
    expect(build({ driveline: 'gears' }).drivetrain.axleRatio).toBeGreaterThan(
      build({ driveline: 'stock' }).drivetrain.axleRatio,
    );
    expect(build({ transmission: 'manual' }).drivetrain.stallRpm).toBe(0);
    const p = build({});
    expect(p.vehicle.powerBrakes).toBe('vacuum');
    expect(p.use.fuelOctane).toBe(87);
  });

  it('returns null when the catalogue has no stock card for the engine', () => {
    expect(
      buildProfileFromAnswers(
        base,
        CARDS.filter((c) => c.baselineForLiters !== 5.3),
      ),
    ).toBeNull();
  });
});

describe('the questionnaire schema and words', () => {
  it('names the field and the reason for a bad answer', () => {
    const parsed = LeadAnswersSchema.safeParse({ ...base, use: 'racing', consent: false });
    expect(parsed.success).toBe(false);
    const fields = parsed.error!.issues.map((i) => i.path.join('.'));
    expect(fields).toEqual(expect.arrayContaining(['use', 'consent']));
  });

  it('puts every answer back into the words the customer saw', () => {
    const words = answersInWords(base);
    expect(words).toHaveLength(CHOICE_QUESTIONS.length);
    expect(words[0]).toEqual({ question: 'Which engine is it?', answer: '5.3 litre' });
  });

  it('shows prices only as "from $X" in whole dollars, rounded down', () => {
    expect(fromPrice(132_899)).toBe('from $1,328');
  });
});
