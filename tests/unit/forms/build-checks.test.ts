import { payloadFromValues } from '@/components/interviews/interview-values';
import { blankInterview, type InterviewValues } from '@/lib/builds/interview-values';
import { buildPayloadChecks } from '@/lib/forms/build-checks';
import { BuildCreateSchema, BuildUpdateSchema } from '@/lib/schemas/build';
import { BUILD_LIMITS } from '@/lib/schemas/build-profile';
import { expectSameVerdict, zodErrors } from '../../support/zod-errors';

// The interview's yup checks against the zod schemas the route uses: the same bad values, fed to both as the
// payload the form sends, must flag the same fields with the same words.

function filled(): InterviewValues {
  const v = blankInterview([]);
  v.customer.name = 'Test Customer';
  v.vehicleLabel = '2012 pickup, 5.3 L';
  v.profile.use.budgetCents = '3500';
  Object.assign(v.profile.baselineCam, {
    name: 'Stock card',
    intakeDuration050: '190',
    exhaustDuration050: '191',
    intakeLiftIn: '0.466',
    exhaustLiftIn: '0.479',
    lsa: '116',
    intakeCenterline: '114',
  });
  return v;
}

type Case = [name: string, change: (v: InterviewValues) => void, flagged: string[]];
const cases: Case[] = [
  ['a bore past the limit', (v) => void (v.profile.engine.boreIn = '4.7'), ['profile.engine.boreIn']],
  [
    'a blank stroke and a word for the compression',
    (v) => Object.assign(v.profile.engine, { strokeIn: '', compressionRatio: 'ten' }),
    ['profile.engine.strokeIn', 'profile.engine.compressionRatio'],
  ],
  ['half a cylinder', (v) => void (v.profile.engine.cylinders = '7.5'), ['profile.engine.cylinders']],
  [
    'a rod too short for the stroke',
    (v) => Object.assign(v.profile.engine, { strokeIn: '4.0', rodLengthIn: '5.5' }),
    ['profile.engine.rodLengthIn'],
  ],
  [
    'an automatic without a stall speed',
    (v) => void (v.profile.drivetrain.stallRpm = ''),
    ['profile.drivetrain.stallRpm'],
  ],
  [
    'an automatic with a stall below its minimum',
    (v) => void (v.profile.drivetrain.stallRpm = '500'),
    ['profile.drivetrain.stallRpm'],
  ],
  [
    'a manual with a launch rpm past the limit',
    (v) => Object.assign(v.profile.drivetrain, { transmission: 'manual', launchRpm: '9000' }),
    ['profile.drivetrain.launchRpm'],
  ],
  [
    'gearing that cruises past the valvetrain',
    (v) => Object.assign(v.profile.drivetrain, { axleRatio: '6.2', topGearRatio: '1.4', tireDiameterIn: '22' }),
    [
      'profile.use.cruiseMph',
      'profile.drivetrain.axleRatio',
      'profile.drivetrain.topGearRatio',
      'profile.drivetrain.tireDiameterIn',
    ],
  ],
  [
    'a budget past the limit',
    (v) => void (v.profile.use.budgetCents = String(BUILD_LIMITS.budgetCents.max / 100 + 1)),
    ['profile.use.budgetCents'],
  ],
  [
    'advertised shorter than the 0.050" duration',
    (v) => void (v.profile.baselineCam.intakeAdvertised = '180'),
    ['profile.baselineCam.intakeAdvertised'],
  ],
  [
    'a blank cam name and a lift past the limit',
    (v) => Object.assign(v.profile.baselineCam, { name: ' ', exhaustLiftIn: '0.95' }),
    ['profile.baselineCam.name', 'profile.baselineCam.exhaustLiftIn'],
  ],
  ['a blank vehicle', (v) => void (v.vehicleLabel = ''), ['vehicleLabel']],
  [
    'a customer with a bad e-mail and phone',
    (v) => Object.assign(v.customer, { email: 'not-an-address', phone: 'call me' }),
    ['customer.email', 'customer.phone'],
  ],
  ['a returning customer nobody picked', (v) => void (v.customerMode = 'existing'), ['customerId']],
  [
    'a weight and an octane out of range',
    (v) => {
      v.profile.vehicle.weightLb = '900';
      v.profile.use.fuelOctane = '130';
    },
    ['profile.vehicle.weightLb', 'profile.use.fuelOctane'],
  ],
];

describe('interview checks: yup in the browser, zod on the server', () => {
  it('passes a whole, sensible interview both ways', () => {
    const payload = payloadFromValues(filled(), 'create');
    expect(zodErrors(BuildCreateSchema, payload)).toEqual({});
    expect(buildPayloadChecks.create(payload)).toEqual({});
  });

  it.each(cases)('%s: the same fields, in the same words', (_name, change, flagged) => {
    const values = filled();
    change(values);
    expectSameVerdict(BuildCreateSchema, buildPayloadChecks.create, payloadFromValues(values, 'create'), flagged);
  });

  it('checks an edit (customer fixed) the way the PATCH schema does', () => {
    const values = filled();
    values.customerMode = 'existing';
    values.customerId = '12';
    values.profile.engine.boreIn = '2';
    expectSameVerdict(BuildUpdateSchema, buildPayloadChecks.edit, payloadFromValues(values, 'edit'), [
      'profile.engine.boreIn',
    ]);
  });
});
