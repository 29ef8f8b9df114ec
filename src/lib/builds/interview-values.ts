import type { CamRecord } from '@/lib/catalogue/types';
import { vehicleClassOf } from '@/lib/schemas/build-profile';

// The interview form's values (every input is text, as typed) and the two conversions around them:
// form → the JSON POST/PATCH /api/builds takes, and a stored build → form. Field names are the API's
// own dotted paths ("profile.engine.boreIn"), so the server's 422 lands on the same inputs.

export type BaselineCard = Pick<
  CamRecord,
  | 'id'
  | 'sku'
  | 'name'
  | 'baselineForLiters'
  | 'intakeDuration050'
  | 'exhaustDuration050'
  | 'intakeAdvertised'
  | 'exhaustAdvertised'
  | 'intakeLiftIn'
  | 'exhaustLiftIn'
  | 'lsa'
  | 'intakeCenterline'
  | 'rockerRatio'
  | 'springMaxLiftIn'
>;

type S = string;
export type InterviewValues = {
  customerMode: 'new' | 'existing';
  customerId: S;
  customer: { name: S; phone: S; email: S; notes: S };
  vehicleLabel: S;
  baselineCamId: S;
  profile: {
    engine: {
      cylinders: S;
      boreIn: S;
      strokeIn: S;
      rodLengthIn: S;
      compressionRatio: S;
      headMaterial: S;
      intakeFlowCfm: S;
      intakeManifold: S;
      cylinderDeactivation: S;
    };
    exhaust: { headers: S; primaryIn: S; system: S };
    drivetrain: { transmission: S; stallRpm: S; launchRpm: S; axleRatio: S; topGearRatio: S; tireDiameterIn: S };
    vehicle: { weightLb: S; powerBrakes: S; class: S };
    // budgetCents holds dollars as typed; the payload turns them into whole cents. budgetKnown 'unsure' is
    // the customer's "not sure yet": no budget is sent (stored as 0, "none given").
    use: {
      primary: S;
      idle: S;
      fuelOctane: S;
      emissionsRequired: 'yes' | 'no';
      cruiseMph: S;
      budgetKnown: 'figure' | 'unsure';
      budgetCents: S;
    };
    baselineCam: {
      id: S;
      name: S;
      intakeDuration050: S;
      exhaustDuration050: S;
      intakeAdvertised: S;
      exhaustAdvertised: S;
      intakeLiftIn: S;
      exhaustLiftIn: S;
      lsa: S;
      intakeCenterline: S;
      rockerRatio: S;
      springMaxLiftIn: S;
    };
  };
};

export type EnginePreset = {
  liters: number;
  label: string;
  boreIn: number;
  strokeIn: number;
  rodLengthIn: number;
  compressionRatio: number;
  headMaterial: 'iron' | 'aluminum';
  intakeFlowCfm: number;
  intakeManifold: 'truck' | 'car';
  cylinderDeactivation: 'none' | 'active';
};

// The common small-block truck and car engines. Bore, stroke, rod length, compression and port flow
// are typical stock figures FROM MEMORY (approximate, not from a published table): the counter checks
// them against the customer's engine and corrects what differs.
export const ENGINE_PRESETS: readonly EnginePreset[] = [
  {
    liters: 4.8,
    label: '4.8 L',
    boreIn: 3.78,
    strokeIn: 3.268,
    rodLengthIn: 6.275,
    compressionRatio: 9.0,
    headMaterial: 'iron',
    intakeFlowCfm: 225,
    intakeManifold: 'truck',
    cylinderDeactivation: 'none',
  },
  {
    liters: 5.3,
    label: '5.3 L',
    boreIn: 3.78,
    strokeIn: 3.622,
    rodLengthIn: 6.098,
    compressionRatio: 9.9,
    headMaterial: 'aluminum',
    intakeFlowCfm: 240,
    intakeManifold: 'truck',
    cylinderDeactivation: 'active',
  },
  {
    liters: 5.7,
    label: '5.7 L',
    boreIn: 3.898,
    strokeIn: 3.622,
    rodLengthIn: 6.098,
    compressionRatio: 10.1,
    headMaterial: 'aluminum',
    intakeFlowCfm: 265,
    intakeManifold: 'car',
    cylinderDeactivation: 'none',
  },
  {
    liters: 6.0,
    label: '6.0 L',
    boreIn: 4.0,
    strokeIn: 3.622,
    rodLengthIn: 6.098,
    compressionRatio: 9.4,
    headMaterial: 'aluminum',
    intakeFlowCfm: 250,
    intakeManifold: 'truck',
    cylinderDeactivation: 'none',
  },
  {
    liters: 6.2,
    label: '6.2 L',
    boreIn: 4.065,
    strokeIn: 3.622,
    rodLengthIn: 6.098,
    compressionRatio: 10.4,
    headMaterial: 'aluminum',
    intakeFlowCfm: 310,
    intakeManifold: 'truck',
    cylinderDeactivation: 'active',
  },
];

const str = (v: unknown) => (v === null || v === undefined ? '' : String(v));

export function applyPreset(values: InterviewValues, preset: EnginePreset, cards: BaselineCard[]): InterviewValues {
  const { liters: _l, label: _n, ...engine } = preset;
  void _l;
  void _n;
  const next: InterviewValues = {
    ...values,
    profile: {
      ...values.profile,
      engine: {
        ...values.profile.engine,
        cylinders: '8',
        ...Object.fromEntries(Object.entries(engine).map(([k, v]) => [k, String(v)])),
      } as InterviewValues['profile']['engine'],
    },
  };
  const card = cards.find((c) => c.baselineForLiters === preset.liters);
  return card ? applyCard(next, card) : next;
}

/** Fills the "cam in the engine now" card from a catalogue card (still editable afterwards). */
export function applyCard(values: InterviewValues, card: BaselineCard | null): InterviewValues {
  if (!card)
    return {
      ...values,
      baselineCamId: '',
      profile: { ...values.profile, baselineCam: { ...values.profile.baselineCam, id: 'typed' } },
    };
  return {
    ...values,
    baselineCamId: String(card.id),
    profile: {
      ...values.profile,
      baselineCam: {
        id: String(card.id),
        name: `${card.sku} ${card.name}`,
        intakeDuration050: str(card.intakeDuration050),
        exhaustDuration050: str(card.exhaustDuration050),
        intakeAdvertised: str(card.intakeAdvertised),
        exhaustAdvertised: str(card.exhaustAdvertised),
        intakeLiftIn: str(card.intakeLiftIn),
        exhaustLiftIn: str(card.exhaustLiftIn),
        lsa: str(card.lsa),
        intakeCenterline: str(card.intakeCenterline),
        rockerRatio: str(card.rockerRatio),
        springMaxLiftIn: str(card.springMaxLiftIn),
      },
    },
  };
}

/** A fresh interview: a 5.3 L truck on pump gas, the most common job at the counter. */
export function blankInterview(cards: BaselineCard[]): InterviewValues {
  const base: InterviewValues = {
    customerMode: 'new',
    customerId: '',
    customer: { name: '', phone: '', email: '', notes: '' },
    vehicleLabel: '',
    baselineCamId: '',
    profile: {
      engine: {
        cylinders: '8',
        boreIn: '',
        strokeIn: '',
        rodLengthIn: '',
        compressionRatio: '',
        headMaterial: 'aluminum',
        intakeFlowCfm: '',
        intakeManifold: 'truck',
        cylinderDeactivation: 'none',
      },
      exhaust: { headers: 'manifold', primaryIn: '', system: 'full-with-cats' },
      drivetrain: {
        transmission: 'automatic',
        stallRpm: '2000',
        launchRpm: '',
        axleRatio: '3.42',
        topGearRatio: '0.70',
        tireDiameterIn: '31',
      },
      vehicle: { weightLb: '5200', powerBrakes: 'vacuum', class: 'truck' },
      use: {
        primary: 'daily',
        idle: 'smooth',
        fuelOctane: '87',
        emissionsRequired: 'yes',
        cruiseMph: '65',
        budgetKnown: 'figure',
        budgetCents: '',
      },
      baselineCam: {
        id: 'typed',
        name: '',
        intakeDuration050: '',
        exhaustDuration050: '',
        intakeAdvertised: '',
        exhaustAdvertised: '',
        intakeLiftIn: '',
        exhaustLiftIn: '',
        lsa: '',
        intakeCenterline: '',
        rockerRatio: '1.7',
        springMaxLiftIn: '',
      },
    },
  };
  return applyPreset(base, ENGINE_PRESETS[1], cards);
}

/** A stored build back into the form (edit page). */
export function valuesFromBuild(
  build: {
    customerId: number;
    customerName: string;
    vehicleLabel: string;
    baselineCamId: number | null;
    profile: Record<string, unknown>;
  },
  cards: BaselineCard[],
): InterviewValues {
  const v = blankInterview(cards);
  const p = build.profile as Record<string, Record<string, unknown>>;
  const section = <K extends keyof InterviewValues['profile']>(key: K): InterviewValues['profile'][K] => {
    const out = { ...v.profile[key] } as Record<string, string>;
    for (const field of Object.keys(out)) out[field] = str(p[key]?.[field]);
    return out as InterviewValues['profile'][K];
  };
  const vehicle = section('vehicle');
  // A profile saved before schema 2 has no class: show the default the advisor and the rules use.
  if (!vehicle.class)
    vehicle.class = vehicleClassOf({ vehicle: {}, engine: { intakeManifold: str(p.engine?.intakeManifold) } });
  const use = section('use');
  use.emissionsRequired = p.use?.emissionsRequired === false ? 'no' : 'yes';
  const budget = Number(p.use?.budgetCents);
  // None stored, or 0 (the schema's "none given"), is the customer's "not sure yet".
  use.budgetKnown = Number.isFinite(budget) && budget > 0 ? 'figure' : 'unsure';
  use.budgetCents = use.budgetKnown === 'figure' ? String(budget / 100) : '';
  return {
    customerMode: 'existing',
    customerId: String(build.customerId),
    customer: { name: build.customerName, phone: '', email: '', notes: '' },
    vehicleLabel: build.vehicleLabel,
    baselineCamId: build.baselineCamId === null ? '' : String(build.baselineCamId),
    profile: {
      engine: section('engine'),
      exhaust: section('exhaust'),
      drivetrain: section('drivetrain'),
      vehicle,
      use,
      baselineCam: section('baselineCam'),
    },
  };
}
