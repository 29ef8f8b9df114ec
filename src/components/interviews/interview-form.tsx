'use client';

import { Form, Formik, useFormikContext, type FormikHelpers } from 'formik';
import { useRouter } from 'next/navigation';
import { useEffect, useMemo, useState } from 'react';
import useSWR from 'swr';
import { SubmitButton } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { displacementCi, litresFromCubicInches } from '@/lib/advisor/geometry';
import { getJson, useVersionedSave } from '@/lib/api-client';
import {
  BUILD_LIMITS as B,
  DEACTIVATION_STATES,
  EXHAUST_SYSTEMS,
  HEAD_MATERIALS,
  HEADER_TYPES,
  IDLE_WISHES,
  INTAKE_MANIFOLDS,
  POWER_BRAKES,
  PRIMARY_USES,
  TRANSMISSIONS,
  VEHICLE_CLASSES,
} from '@/lib/schemas/build-profile';
import { CAM_LIMITS as C } from '@/lib/schemas/cam-card';
import { CUSTOMER_LIMITS } from '@/lib/schemas/customer';
import { NumberField, SelectField, TextField } from '@/components/ui/formik-fields';
import { Section } from './section';
import {
  applyCard,
  applyPreset,
  blankInterview,
  ENGINE_PRESETS,
  valuesFromBuild,
  type BaselineCard,
  type InterviewValues,
} from '@/lib/builds/interview-values';
import { interviewChecks, nestErrors, payloadFromValues } from './interview-values';

// The counter interview: one form, sections in the order the conversation goes. Enter moves to the
// next field (Ctrl+Enter saves from anywhere); Tab order follows the page. Checked in the browser with yup
// built from the limits the zod schemas export (lib/forms/build-checks.ts), in the server's words.

const WORDS: Record<string, string> = {
  iron: 'Iron',
  aluminum: 'Aluminium',
  truck: 'Truck (long runners)',
  car: 'Car (lower, shorter runners)',
  'single-plane': 'Single-plane (race style)',
  none: 'None fitted',
  active: 'Fitted and working',
  deleted: 'Deleted (disabled)',
  manifold: 'Cast manifolds (stock)',
  shorty: 'Shorty headers',
  'long-tube': 'Long-tube headers',
  full: 'Full exhaust, no cats',
  'full-with-cats': 'Full exhaust with catalytic converters',
  'open-short': 'Short or open collectors',
  automatic: 'Automatic',
  manual: 'Manual',
  vacuum: 'Vacuum booster',
  hydraulic: 'Hydraulic assist',
  daily: 'Daily driver',
  towing: 'Towing and hauling',
  street: 'Street performance',
  strip: 'Drag strip',
  smooth: 'Smooth, like stock',
  noticeable: 'A noticeable lope',
  aggressive: 'Aggressive, choppy',
};
const opts = (values: readonly string[]) => values.map((v) => [v, WORDS[v] ?? v] as const);
// Vehicle classes get their own words: "truck" above is the intake's name.
const VEHICLE_WORDS: Record<(typeof VEHICLE_CLASSES)[number], string> = {
  truck: 'Pickup truck',
  suv: 'SUV',
  van: 'Van',
  car: 'Car',
};

type Props =
  | { mode: 'create'; cards: BaselineCard[]; prefill?: InterviewValues | null; leadId?: number }
  | {
      mode: 'edit';
      cards: BaselineCard[];
      build: {
        id: number;
        version: number;
        customerId: number;
        customerName: string;
        vehicleLabel: string;
        baselineCamId: number | null;
        profile: Record<string, unknown>;
      };
    };

export function InterviewForm(props: Props) {
  const router = useRouter();
  const { cards, mode } = props;
  const [problem, setProblem] = useState<React.ReactNode>(null);
  const { save } = useVersionedSave(props.mode === 'edit' ? props.build : null);
  const initial = useMemo(
    () => (props.mode === 'edit' ? valuesFromBuild(props.build, cards) : (props.prefill ?? blankInterview(cards))),
    [props, cards],
  );
  const validate = useMemo(() => interviewChecks(mode), [mode]);

  async function onSubmit(values: InterviewValues, helpers: FormikHelpers<InterviewValues>) {
    setProblem(null);
    const payload = payloadFromValues(values, mode);
    const answer =
      props.mode === 'edit'
        ? await save('PATCH', `/api/builds/${props.build.id}`, payload)
        : await save(
            'POST',
            '/api/builds',
            'leadId' in props && props.leadId ? { ...payload, leadId: props.leadId } : payload,
          );
    if (answer.status === 200 || answer.status === 201) {
      router.push(`/advisor?build=${String(answer.body.id)}`);
      return;
    }
    if (answer.status === 422 && answer.body.errors) {
      helpers.setErrors(nestErrors(answer.body.errors));
      setProblem(
        <>Some answers need attention: {answer.body.errors.map((e) => `${e.field}: ${e.message}`).join('; ')}</>,
      );
      return;
    }
    if (answer.status === 409) {
      setProblem(
        <>
          {answer.body.message}{' '}
          <a className="underline" href="">
            Reload this page
          </a>{' '}
          to see the saved build, then make your changes again.
        </>,
      );
      return;
    }
    setProblem(answer.body.message ?? `The server answered ${answer.status}. Nothing was saved; try again.`);
  }

  return (
    <Formik initialValues={initial} validate={validate} onSubmit={onSubmit} validateOnChange={false}>
      {(formik) => (
        <Form
          noValidate
          className="flex flex-col gap-4"
          aria-label={mode === 'edit' ? 'Edit build' : 'Counter interview'}
          onKeyDown={(e) => {
            if (e.key !== 'Enter') return;
            const target = e.target as HTMLElement;
            if (target instanceof HTMLTextAreaElement || target instanceof HTMLButtonElement) return;
            e.preventDefault();
            if (e.ctrlKey || e.metaKey) {
              void formik.submitForm();
              return;
            }
            const order = Array.from(
              e.currentTarget.querySelectorAll<HTMLElement>(
                'input:not([type=hidden]):not([disabled]), select:not([disabled]), textarea:not([disabled]), button[type=submit]',
              ),
            );
            order[order.indexOf(target) + 1]?.focus();
          }}
        >
          <FocusFirstProblem />
          <p className="text-sm text-ink-soft">
            Enter moves to the next question; Ctrl+Enter saves from anywhere. Figures start at a stock 5.3 L truck:
            change what differs.
          </p>
          <CustomerSection mode={mode} />
          <VehicleSection />
          <EngineSection cards={cards} />
          <Section step={4} title="Heads and intake">
            <SelectField
              name="profile.engine.headMaterial"
              label="Cylinder head material"
              options={opts(HEAD_MATERIALS)}
              hint="Iron heads want a little less compression."
            />
            <NumberField
              name="profile.engine.intakeFlowCfm"
              label="Intake port flow at 28 inH₂O"
              unit="cfm"
              range={B.intakeFlowCfm}
              decimals={false}
            />
            <SelectField
              name="profile.engine.intakeManifold"
              label="Intake manifold"
              options={opts(INTAKE_MANIFOLDS)}
            />
          </Section>
          <ExhaustSection />
          <DrivetrainSection />
          <WishesSection />
          <BaselineSection cards={cards} />
          {problem ? <Banner tone="fault">{problem}</Banner> : null}
          <div className="flex flex-wrap items-center gap-3">
            <SubmitButton busy={formik.isSubmitting}>
              {mode === 'edit' ? 'Save and open the shortlist' : 'Save and rank cams'}
            </SubmitButton>
            <span className="text-xs text-ink-muted">Saving takes you to the cam shortlist for this build.</span>
          </div>
        </Form>
      )}
    </Formik>
  );
}

/** After a refused save, put the cursor on the first answer that needs attention. */
function FocusFirstProblem() {
  const { submitCount, isValid, isSubmitting } = useFormikContext<InterviewValues>();
  useEffect(() => {
    if (submitCount > 0 && !isValid && !isSubmitting)
      document.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [submitCount, isValid, isSubmitting]);
  return null;
}

type CustomerHit = { id: number; name: string; phone: string | null; email: string | null };

function CustomerSection({ mode }: { mode: 'create' | 'edit' }) {
  const { values, setFieldValue, errors, submitCount } = useFormikContext<InterviewValues>();
  const [search, setSearch] = useState('');
  const q = search.trim();
  const { data } = useSWR<{ items: CustomerHit[] }>(
    mode === 'create' && values.customerMode === 'existing' && q.length >= 2
      ? `/api/customers?pageSize=8&q=${encodeURIComponent(q)}`
      : null,
    getJson,
  );
  const hits = data?.items ?? [];
  const pick = (hit: CustomerHit) => {
    void setFieldValue('customerId', String(hit.id));
    void setFieldValue('customer.name', hit.name);
  };

  if (mode === 'edit') {
    return (
      <Section step={1} title="Customer">
        <p className="text-sm sm:col-span-2">
          {values.customer.name} <span className="text-ink-muted">(customer #{values.customerId})</span>
        </p>
      </Section>
    );
  }
  const modeButton = (m: 'new' | 'existing', text: string) => (
    <button
      type="button"
      aria-pressed={values.customerMode === m}
      onClick={() => void setFieldValue('customerMode', m)}
      className={`rounded px-3 py-1.5 text-sm font-semibold ring-1 ${values.customerMode === m ? 'bg-ink text-paper-raised ring-ink' : 'bg-paper-raised text-ink ring-steel-300'}`}
    >
      {text}
    </button>
  );
  return (
    <Section
      step={1}
      title="Customer"
      lead="Who is at the counter. Name is enough to start; a phone or e-mail lets the shop send the quote."
    >
      <div className="flex gap-2 sm:col-span-2 lg:col-span-4" role="group" aria-label="New or returning customer">
        {modeButton('new', 'New customer')}
        {modeButton('existing', 'Returning customer')}
      </div>
      {values.customerMode === 'new' ? (
        <>
          <TextField
            name="customer.name"
            label="Name"
            autoFocus
            maxLength={CUSTOMER_LIMITS.nameMaxLength}
            autoComplete="off"
          />
          <TextField name="customer.phone" label="Phone" type="tel" maxLength={CUSTOMER_LIMITS.phoneMaxLength} />
          <TextField
            name="customer.email"
            label="E-mail"
            type="email"
            maxLength={CUSTOMER_LIMITS.emailMaxLength}
            hint="Optional; the quote goes here."
          />
          <TextField name="customer.notes" label="Notes" maxLength={CUSTOMER_LIMITS.notesMaxLength} hint="Optional." />
        </>
      ) : (
        <div className="flex flex-col gap-1 sm:col-span-2">
          <label htmlFor="customer-search" className="text-sm font-semibold">
            Find by name, phone or e-mail
          </label>
          <input
            id="customer-search"
            type="search"
            autoComplete="off"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'Enter' && hits[0]) pick(hits[0]);
            }}
            className="rounded border border-steel-300 bg-paper-raised px-3 py-2"
            aria-describedby="customer-picked"
          />
          <ul className="flex flex-col gap-1" aria-label="Matching customers">
            {hits.map((hit) => (
              <li key={hit.id}>
                <button
                  type="button"
                  onClick={() => pick(hit)}
                  className="w-full rounded px-2 py-1 text-left text-sm ring-1 ring-steel-300 hover:ring-gauge-500"
                >
                  {hit.name}{' '}
                  <span className="text-ink-muted">{[hit.phone, hit.email].filter(Boolean).join(' · ')}</span>
                </button>
              </li>
            ))}
            {q.length >= 2 && data && hits.length === 0 ? (
              <li className="text-sm text-ink-muted">No customer matches; switch to “New customer”.</li>
            ) : null}
          </ul>
          <p id="customer-picked" className="text-sm">
            {values.customerId ? (
              <>
                Picked: <strong>{values.customer.name}</strong>
              </>
            ) : (
              'Nobody picked yet.'
            )}
          </p>
          {submitCount > 0 && errors.customerId ? (
            <p className="text-xs text-fault-700">Problem: {errors.customerId}</p>
          ) : null}
        </div>
      )}
    </Section>
  );
}

function VehicleSection() {
  return (
    <Section step={2} title="Vehicle and use" lead="What it is, what it weighs, and what the customer does with it.">
      <TextField
        name="vehicleLabel"
        label="Vehicle"
        hint="Year, body, engine, e.g. “2012 crew-cab pickup, 5.3 L”."
        className="sm:col-span-2"
      />
      <SelectField
        name="profile.vehicle.class"
        label="Kind of vehicle"
        options={VEHICLE_CLASSES.map((v) => [v, VEHICLE_WORDS[v]] as const)}
        hint="The shop prices the cam install by it."
      />
      <NumberField
        name="profile.vehicle.weightLb"
        label="Weight as driven"
        unit="lb"
        range={B.weightLb}
        decimals={false}
      />
      <SelectField
        name="profile.vehicle.powerBrakes"
        label="Power brakes"
        options={opts(POWER_BRAKES)}
        hint="A vacuum booster wants about 15 inHg at idle."
      />
      <SelectField name="profile.use.primary" label="Mostly used for" options={opts(PRIMARY_USES)} />
      <NumberField
        name="profile.use.cruiseMph"
        label="Usual cruise speed"
        unit="mph"
        range={B.cruiseMph}
        decimals={false}
      />
    </Section>
  );
}

function EngineSection({ cards }: { cards: BaselineCard[] }) {
  const { values, setValues } = useFormikContext<InterviewValues>();
  const e = values.profile.engine;
  const bore = Number(e.boreIn),
    stroke = Number(e.strokeIn),
    cyl = Number(e.cylinders);
  const ci = bore > 0 && stroke > 0 && cyl > 0 ? displacementCi(bore, stroke, cyl) : null;
  return (
    <Section
      step={3}
      title="Engine"
      lead="Pick the engine to fill stock figures (typical values from memory; check them), then correct what differs."
    >
      <div
        className="flex flex-wrap items-center gap-2 sm:col-span-2 lg:col-span-4"
        role="group"
        aria-label="Stock engine presets"
      >
        <span className="text-sm font-semibold">Stock engine:</span>
        {ENGINE_PRESETS.map((preset) => (
          <button
            key={preset.label}
            type="button"
            onClick={() => void setValues(applyPreset(values, preset, cards), false)}
            className="rounded bg-paper-raised px-3 py-1.5 text-sm font-semibold ring-1 ring-steel-300 hover:ring-gauge-500"
          >
            {preset.label}
          </button>
        ))}
      </div>
      <NumberField name="profile.engine.cylinders" label="Cylinders" unit="cyl" range={B.cylinders} decimals={false} />
      <NumberField name="profile.engine.boreIn" label="Bore" unit="in" range={B.boreIn} />
      <NumberField name="profile.engine.strokeIn" label="Stroke" unit="in" range={B.strokeIn} />
      <NumberField
        name="profile.engine.rodLengthIn"
        label="Rod length"
        unit="in"
        range={B.rodLengthIn}
        hint={`${B.rodLengthIn.min}–${B.rodLengthIn.max} in, at least ${B.rodStrokeRatio.min} × stroke`}
      />
      <NumberField
        name="profile.engine.compressionRatio"
        label="Static compression ratio"
        unit=":1"
        range={B.compressionRatio}
      />
      <SelectField
        name="profile.engine.cylinderDeactivation"
        label="Cylinder deactivation"
        options={opts(DEACTIVATION_STATES)}
      />
      <p className="spec self-end text-sm text-ink-soft sm:col-span-2" aria-live="polite">
        {ci
          ? `Displacement ${ci.toFixed(0)} in³ (${litresFromCubicInches(ci).toFixed(1)} L)`
          : 'Displacement: enter bore, stroke and cylinders'}
      </p>
    </Section>
  );
}

function ExhaustSection() {
  const { values } = useFormikContext<InterviewValues>();
  const headers = values.profile.exhaust.headers !== 'manifold';
  return (
    <Section step={5} title="Exhaust">
      <SelectField name="profile.exhaust.headers" label="Headers" options={opts(HEADER_TYPES)} />
      {headers ? (
        <NumberField
          name="profile.exhaust.primaryIn"
          label="Primary tube diameter"
          unit="in"
          range={B.primaryIn}
          hint={`Optional; blank means ${B.primaryIn.default} in`}
        />
      ) : null}
      <SelectField name="profile.exhaust.system" label="Exhaust system" options={opts(EXHAUST_SYSTEMS)} />
    </Section>
  );
}

function DrivetrainSection() {
  const { values } = useFormikContext<InterviewValues>();
  const manual = values.profile.drivetrain.transmission === 'manual';
  return (
    <Section step={6} title="Drivetrain">
      <SelectField name="profile.drivetrain.transmission" label="Transmission" options={opts(TRANSMISSIONS)} />
      {manual ? (
        <NumberField
          name="profile.drivetrain.launchRpm"
          label="Launch rpm"
          unit="rpm"
          range={B.launchRpm}
          hint="Optional; blank uses a default for the use."
          decimals={false}
        />
      ) : (
        <NumberField
          name="profile.drivetrain.stallRpm"
          label="Converter stall speed"
          unit="rpm"
          range={{ min: B.stallRpm.automaticMin, max: B.stallRpm.max }}
          decimals={false}
        />
      )}
      <NumberField name="profile.drivetrain.axleRatio" label="Axle ratio" unit=":1" range={B.axleRatio} />
      <NumberField
        name="profile.drivetrain.topGearRatio"
        label="Top gear ratio"
        unit=":1"
        range={B.topGearRatio}
        hint="Overdrive is below 1, e.g. 0.70"
      />
      <NumberField name="profile.drivetrain.tireDiameterIn" label="Tyre diameter" unit="in" range={B.tireDiameterIn} />
    </Section>
  );
}

function WishesSection() {
  const { values } = useFormikContext<InterviewValues>();
  const u = values.profile.use;
  return (
    <Section
      step={7}
      title="Wishes"
      lead="How it should idle, what it burns, whether it has to pass emissions, and what the customer wants to spend."
    >
      <SelectField name="profile.use.idle" label="Idle" options={opts(IDLE_WISHES)} />
      <NumberField
        name="profile.use.fuelOctane"
        label="Pump fuel octane, (R+M)/2"
        unit="AKI"
        range={B.fuelOctane}
        decimals={false}
      />
      <SelectField
        name="profile.use.emissionsRequired"
        label="Must it stay road-legal for emissions?"
        options={[
          ['yes', 'Yes, road-legal emissions needed'],
          ['no', 'No (off-road or exempt)'],
        ]}
      />
      <SelectField
        name="profile.use.budgetKnown"
        label="Budget"
        options={[
          ['figure', 'The customer named a figure'],
          ['unsure', 'Not sure yet'],
        ]}
      />
      {u.budgetKnown === 'figure' ? (
        <NumberField
          name="profile.use.budgetCents"
          label="Budget for the whole job"
          unit="$"
          hint="Dollars, parts and labour together."
        />
      ) : (
        <p className="self-end text-sm text-ink-soft">
          No budget: the shortlist judges no cam against a figure; ask again before quoting.
        </p>
      )}
      <div className="flex flex-col gap-2 sm:col-span-2 lg:col-span-4">
        {u.emissionsRequired === 'yes' ? (
          <Banner tone="caution">
            Emissions: many jurisdictions forbid an aftermarket cam on a road vehicle unless the part is certified for
            it; follow local codes. The shortlist marks cams that are not certified.
          </Banner>
        ) : null}
        {u.idle === 'aggressive' && values.profile.vehicle.powerBrakes === 'vacuum' ? (
          <Banner tone="caution">
            Brakes: a choppy idle means less idle vacuum and less brake assist from a vacuum booster; a qualified
            technician should check it after the swap.
          </Banner>
        ) : null}
      </div>
    </Section>
  );
}

function BaselineSection({ cards }: { cards: BaselineCard[] }) {
  const { values, setValues } = useFormikContext<InterviewValues>();
  const choose = (value: string) =>
    void setValues(applyCard(values, cards.find((c) => String(c.id) === value) ?? null), false);
  return (
    <Section
      step={8}
      title="The cam in the engine now"
      lead="Pick the stock card from the catalogue, or type the card of the cam that is in it."
    >
      <div className="sm:col-span-2">
        <SelectField
          name="baselineCamId"
          label="Cam in the engine now"
          options={[...cards.map((c) => [String(c.id), `${c.sku} ${c.name}`] as const), ['', 'Typed from a card']]}
          onPick={choose}
        />
      </div>
      <TextField
        name="profile.baselineCam.name"
        label="Cam name on the card"
        maxLength={C.nameMaxLength}
        className="sm:col-span-2"
      />
      <NumberField
        name="profile.baselineCam.intakeDuration050"
        label='Intake duration at 0.050"'
        unit="deg"
        range={C.duration050Deg}
      />
      <NumberField
        name="profile.baselineCam.exhaustDuration050"
        label='Exhaust duration at 0.050"'
        unit="deg"
        range={C.duration050Deg}
      />
      <NumberField
        name="profile.baselineCam.intakeLiftIn"
        label="Intake lift at the valve"
        unit="in"
        range={C.liftIn}
      />
      <NumberField
        name="profile.baselineCam.exhaustLiftIn"
        label="Exhaust lift at the valve"
        unit="in"
        range={C.liftIn}
      />
      <NumberField name="profile.baselineCam.lsa" label="Lobe separation angle" unit="deg" range={C.lsaDeg} />
      <NumberField
        name="profile.baselineCam.intakeCenterline"
        label="Installed intake centerline"
        unit="deg ATDC"
        range={C.intakeCenterlineDeg}
      />
      <NumberField name="profile.baselineCam.rockerRatio" label="Rocker ratio" unit=":1" range={C.rockerRatio} />
      <NumberField
        name="profile.baselineCam.intakeAdvertised"
        label="Intake advertised duration"
        unit="deg"
        hint={`Optional; ${C.advertisedDeg.min}–${C.advertisedDeg.max} deg`}
      />
      <NumberField
        name="profile.baselineCam.exhaustAdvertised"
        label="Exhaust advertised duration"
        unit="deg"
        hint={`Optional; ${C.advertisedDeg.min}–${C.advertisedDeg.max} deg`}
      />
      <NumberField
        name="profile.baselineCam.springMaxLiftIn"
        label="Max lift of the springs fitted now"
        unit="in"
        hint={`Optional; ${C.springMaxLiftIn.min}–${C.springMaxLiftIn.max} in`}
      />
    </Section>
  );
}
