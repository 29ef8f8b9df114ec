import fc from 'fast-check';
import { rankCams } from '@/lib/advisor';
import {
  BUILD_LIMITS,
  BuildProfileSchema,
  EXHAUST_SYSTEMS,
  HEAD_MATERIALS,
  HEADER_TYPES,
  IDLE_WISHES,
  INTAKE_MANIFOLDS,
  POWER_BRAKES,
  PRIMARY_USES,
  DEACTIVATION_STATES,
  TRANSMISSIONS,
} from '@/lib/schemas/build-profile';
import { CAM_LIMITS, CamCardSchema, CamCatalogueSchema } from '@/lib/schemas/cam-card';
import { formatZodIssues } from '@/lib/schemas/errors';
import { dynoInput, truckCam } from './fixtures';

// A fixed seed keeps CI repeatable (a property that fails once fails every time); FC_SEED explores others
// locally. No shrinking in CI: shrinking a failure through the cycle model ran for over an hour; the
// failing value and seed are reported as found.
const FC = { seed: Number(process.env.FC_SEED ?? 20261203), endOnFailure: true } as const;

const inRange = (r: { min: number; max: number }) =>
  fc.double({ min: r.min, max: r.max, noNaN: true, noDefaultInfinity: true });
const pick = <T>(values: readonly T[]) => fc.constantFrom(...values);

// Any schema-valid cam card (within CAM_LIMITS), advertised durations longer than the 0.050" ones.
const camArb = fc.record(
  {
    id: fc.oneof(
      fc.string({ minLength: 1, maxLength: 20 }).filter((s) => s.trim().length > 0),
      fc.nat(),
    ),
    name: fc.constant('generated grind'),
    intakeDuration050: inRange(CAM_LIMITS.duration050Deg),
    exhaustDuration050: inRange(CAM_LIMITS.duration050Deg),
    intakeLiftIn: inRange(CAM_LIMITS.liftIn),
    exhaustLiftIn: inRange(CAM_LIMITS.liftIn),
    lsa: inRange(CAM_LIMITS.lsaDeg),
    intakeCenterline: inRange(CAM_LIMITS.intakeCenterlineDeg),
    priceCents: fc.option(fc.integer({ min: 0, max: CAM_LIMITS.priceCents.max }), { nil: undefined }),
    deactivationCompatible: fc.option(fc.boolean(), { nil: undefined }),
    emissionsCertified: fc.option(fc.boolean(), { nil: undefined }),
    springMaxLiftIn: fc.option(inRange(CAM_LIMITS.springMaxLiftIn), { nil: undefined }),
  },
  {
    requiredKeys: [
      'id',
      'name',
      'intakeDuration050',
      'exhaustDuration050',
      'intakeLiftIn',
      'exhaustLiftIn',
      'lsa',
      'intakeCenterline',
    ],
  },
);

const B = BUILD_LIMITS;
const buildArb = fc.record({
  engine: fc.record({
    cylinders: fc.integer({ min: 4, max: 12 }),
    boreIn: inRange(B.boreIn),
    strokeIn: inRange(B.strokeIn),
    rodLengthIn: inRange({ min: 6.3, max: B.rodLengthIn.max }),
    compressionRatio: inRange(B.compressionRatio),
    headMaterial: pick(HEAD_MATERIALS),
    intakeFlowCfm: inRange(B.intakeFlowCfm),
    intakeManifold: pick(INTAKE_MANIFOLDS),
    cylinderDeactivation: pick(DEACTIVATION_STATES),
  }),
  exhaust: fc.record({ headers: pick(HEADER_TYPES), primaryIn: inRange(B.primaryIn), system: pick(EXHAUST_SYSTEMS) }),
  drivetrain: fc.record({
    transmission: pick(TRANSMISSIONS),
    stallRpm: fc.integer({ min: 1000, max: 6000 }),
    axleRatio: inRange(B.axleRatio),
    topGearRatio: inRange(B.topGearRatio),
    tireDiameterIn: inRange(B.tireDiameterIn),
  }),
  vehicle: fc.record({ weightLb: inRange(B.weightLb), powerBrakes: pick(POWER_BRAKES) }),
  use: fc.record({
    primary: pick(PRIMARY_USES),
    idle: pick(IDLE_WISHES),
    fuelOctane: inRange(B.fuelOctane),
    emissionsRequired: fc.boolean(),
    cruiseMph: inRange(B.cruiseMph),
    budgetCents: fc.integer({ min: 0, max: B.budgetCents.max }),
  }),
  baselineCam: camArb,
});

// Hostile values: wrong types, NaN-ish strings, huge numbers, prototype keys, deep nesting.
const hostile = fc.oneof(
  fc.anything({ withNullPrototype: true, withBigInt: false, maxDepth: 3 }),
  fc.constantFrom(null, undefined, '', '3.78', Number.NaN, Infinity, -Infinity, 1e308, -0, [], {}, '__proto__', {
    __proto__: { boreIn: 4 },
  }),
);

const corrupt = (base: unknown, path: string[], value: unknown): unknown => {
  if (path.length === 0) return value;
  const obj = (typeof base === 'object' && base !== null ? { ...(base as Record<string, unknown>) } : {}) as Record<
    string,
    unknown
  >;
  obj[path[0]] = corrupt(obj[path[0]], path.slice(1), value);
  return obj;
};
const fieldPaths = [
  ['engine'],
  ['engine', 'boreIn'],
  ['engine', 'strokeIn'],
  ['engine', 'rodLengthIn'],
  ['engine', 'headMaterial'],
  ['engine', 'cylinders'],
  ['exhaust', 'system'],
  ['drivetrain', 'stallRpm'],
  ['drivetrain', 'transmission'],
  ['use', 'fuelOctane'],
  ['use', 'budgetCents'],
  ['baselineCam'],
  ['baselineCam', 'id'],
  ['baselineCam', 'lsa'],
  ['baselineCam', 'rockerRatio'],
  ['vehicle'],
  ['extra'],
];

describe('schemas under random and hostile input (fast-check)', () => {
  it('safeParse never throws on anything, and failures name a field with a message', () => {
    fc.assert(
      fc.property(hostile, (input) => {
        for (const schema of [BuildProfileSchema, CamCardSchema, CamCatalogueSchema]) {
          const r = schema.safeParse(input);
          if (!r.success) {
            const issues = formatZodIssues(r.error);
            expect(issues.length).toBeGreaterThan(0);
            for (const i of issues)
              expect(typeof i.field === 'string' && i.field.length > 0 && i.message.length > 0).toBe(true);
          }
        }
      }),
      { ...FC, numRuns: 400 },
    );
  });

  it('a valid profile with one field made hostile is rejected at that field (or accepted if still valid), never a throw', () => {
    fc.assert(
      fc.property(pick(fieldPaths), hostile, (path, value) => {
        const r = BuildProfileSchema.safeParse(corrupt(dynoInput, path, value));
        if (!r.success) {
          const fields = formatZodIssues(r.error).map((i) => i.field);
          expect(fields.some((f) => f === path.join('.') || f.startsWith(`${path[0]}`))).toBe(true);
        }
      }),
      { ...FC, numRuns: 400 },
    );
  });

  it('out-of-range numbers are rejected with the unit in the message', () => {
    const r = BuildProfileSchema.safeParse(corrupt(dynoInput, ['engine', 'boreIn'], 9.9));
    expect(r.success).toBe(false);
    if (!r.success)
      expect(formatZodIssues(r.error)).toEqual([{ field: 'engine.boreIn', message: 'bore must be at most 4.6 in' }]);
    const k = BuildProfileSchema.safeParse(corrupt(dynoInput, ['engine', 'turbo'], true));
    if (!k.success) expect(formatZodIssues(k.error)).toEqual([{ field: 'engine.turbo', message: 'unknown field' }]);
    expect(k.success).toBe(false);
  });

  it('rockerRatio defaults to 1.7; null optional fields read as not given', () => {
    const c = CamCardSchema.parse({
      ...truckCam,
      rockerRatio: undefined,
      intakeAdvertised: null,
      springMaxLiftIn: null,
    });
    expect(c.rockerRatio).toBe(1.7);
    expect(c.intakeAdvertised).toBeUndefined();
  });

  it('a huge exhaust lift on a tiny engine cannot empty the cylinder through both valves at once (was NaN; found by seed 873046452)', () => {
    // The exact values fast-check found: the cylinder empties only at this corner, so they are kept unrounded.
    const build = BuildProfileSchema.parse({
      engine: {
        cylinders: 4,
        boreIn: 2.5,
        strokeIn: 2.5,
        rodLengthIn: 6.3,
        compressionRatio: 11.021676169890881,
        headMaterial: 'iron',
        intakeFlowCfm: 253.80204538495576,
        intakeManifold: 'truck',
        cylinderDeactivation: 'none',
      },
      exhaust: { headers: 'long-tube', primaryIn: 1.5826838597250672, system: 'full' },
      drivetrain: {
        transmission: 'automatic',
        stallRpm: 1000,
        axleRatio: 2.0000000000000053,
        topGearRatio: 0.8517972033768756,
        tireDiameterIn: 20.000000000000018,
      },
      vehicle: { weightLb: 1500.0000000000018, powerBrakes: 'hydraulic' },
      use: {
        primary: 'daily',
        idle: 'aggressive',
        fuelOctane: 90.70973827174862,
        emissionsRequired: false,
        cruiseMph: 20.00000000000005,
        budgetCents: 39688777,
      },
      baselineCam: {
        id: 'm',
        name: 'odd grind',
        intakeDuration050: 299.9999999999997,
        exhaustDuration050: 195.68888824674156,
        intakeLiftIn: 0.25000000000000067,
        exhaustLiftIn: 0.43716696100495955,
        lsa: 100.00000000000023,
        intakeCenterline: 116.5762100443325,
      },
    });
    const cams = CamCatalogueSchema.parse([
      {
        id: 1,
        name: 'odd grind 2',
        intakeDuration050: 150.0000000000001,
        exhaustDuration050: 225.51161483361258,
        intakeLiftIn: 0.4129960923815172,
        exhaustLiftIn: 0.8999999999999997,
        lsa: 108.5110447635302,
        intakeCenterline: 101.93121396768522,
      },
    ]);
    const r = rankCams(build, cams);
    expect(Number.isFinite(r.rankings[0].score)).toBe(true);
    expect(r.rankings[0].curve.every((p) => Number.isFinite(p.torqueLbFt) && p.torqueLbFt > 0)).toBe(true);
  });

  it('the ranking never throws for schema-valid input and always gives finite numbers', () => {
    fc.assert(
      fc.property(buildArb, fc.array(camArb, { minLength: 1, maxLength: 4 }), (rawBuild, rawCams) => {
        const b = BuildProfileSchema.safeParse(rawBuild);
        const cams = CamCatalogueSchema.safeParse(rawCams);
        fc.pre(b.success && cams.success);
        if (!b.success || !cams.success) return;
        const r = rankCams(b.data, cams.data);
        expect(r.rankings.length).toBe(rawCams.length);
        const numbers: number[] = [];
        const walk = (v: unknown) => {
          if (typeof v === 'number') numbers.push(v);
          else if (Array.isArray(v)) v.forEach(walk);
          else if (v && typeof v === 'object') Object.values(v).forEach(walk);
        };
        walk(r);
        expect(numbers.every(Number.isFinite)).toBe(true);
        for (const x of r.rankings) {
          expect(x.score).toBeGreaterThanOrEqual(0);
          expect(x.score).toBeLessThanOrEqual(100);
          for (const p of x.curve) expect(p.hp).toBe((p.torqueLbFt * p.rpm) / 5252);
        }
        // Each ranking now runs the engine-cycle model (tens of ms per cam under ts-jest): 40 random builds keep the suite in minutes.
      }),
      { ...FC, numRuns: 40 },
    );
  });
});
