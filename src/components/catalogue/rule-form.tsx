'use client';

import { FieldArray, Form, Formik } from 'formik';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { VEHICLE_CLASSES, type VehicleClass } from '@/lib/schemas/build-profile';
import { ruleChecks } from '@/lib/forms/rule-checks';
import { nestFieldErrors } from '@/lib/forms/yup-limits';
import {
  NEED_RULE_KIND_OPTIONS,
  NEED_RULE_KIND_TEXT,
  NEED_RULE_LIMITS,
  RULE_VEHICLE_CLASS_TEXT,
} from '@/lib/schemas/need-rule';
import { sendJson, useVersionedSave } from '@/lib/api-client';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { ConflictBanner } from '@/components/ui/conflict-banner';
import { RadioGroup, type Options } from '@/components/ui/field';
import { CheckboxField, NumberField, SelectField, TextField } from '@/components/ui/formik-fields';

type Item = { partId: string; laborOperationId: string; quantity: string };
type Values = {
  kind: (typeof NEED_RULE_KIND_OPTIONS)[number];
  vehicleClass: VehicleClass | 'any';
  label: string;
  active: boolean;
  items: Item[];
};
type RuleRecord = {
  id: number;
  version: number;
  kind: Values['kind'];
  vehicleClass: VehicleClass | null;
  label: string;
  active: boolean;
  items: { partId: number | null; laborOperationId: number | null; quantity: number }[];
};

const toPayload = (v: Values) => ({
  kind: v.kind,
  vehicleClass: v.vehicleClass === 'any' ? null : v.vehicleClass,
  label: v.label,
  active: v.active,
  items: v.items.map((i) => ({
    partId: i.partId ? Number(i.partId) : null,
    laborOperationId: i.laborOperationId ? Number(i.laborOperationId) : null,
    quantity: i.quantity ? Number(i.quantity) : 1,
  })),
});

/** A stored rule as the form's values; a new rule starts with one empty item. */
const valuesOf = (rule: RuleRecord | null): Values => ({
  kind: rule?.kind ?? 'install',
  vehicleClass: rule?.vehicleClass ?? 'any',
  label: rule?.label ?? '',
  active: rule?.active ?? true,
  items: rule?.items.map((i) => ({
    partId: i.partId ? String(i.partId) : '',
    laborOperationId: i.laborOperationId ? String(i.laborOperationId) : '',
    quantity: String(i.quantity),
  })) ?? [{ partId: '', laborOperationId: '', quantity: '1' }],
});

export function RuleForm({
  rule,
  parts,
  labor,
}: {
  rule: RuleRecord | null;
  parts: { id: number; sku: string; name: string }[];
  labor: { id: number; code: string; name: string }[];
}) {
  const router = useRouter();
  const { conflict, save, settle } = useVersionedSave<RuleRecord>(rule);
  const [problem, setProblem] = useState<string | null>(null);
  const initial = valuesOf(rule);
  const partOptions: Options = [
    ['', '(no part)'],
    ...parts.map((p) => [String(p.id), `${p.sku} — ${p.name}`] as const),
  ];
  const laborOptions: Options = [
    ['', '(no labour)'],
    ...labor.map((l) => [String(l.id), `${l.code} — ${l.name}`] as const),
  ];
  return (
    <Formik<Values>
      initialValues={initial}
      // yup from the schema's limits, over the JSON the route will get (lib/forms/rule-checks.ts); the route re-checks with zod.
      validate={(values) => nestFieldErrors(ruleChecks(toPayload(values)))}
      onSubmit={async (values) => {
        setProblem(null);
        const result = rule
          ? await save('PATCH', `/api/rules/${rule.id}`, toPayload(values))
          : await save('POST', '/api/rules', toPayload(values));
        if (result.ok) {
          router.push('/catalogue/rules?saved=1');
          router.refresh();
        } else if (result.status !== 409)
          setProblem(
            result.body.errors?.map((e) => `${e.field}: ${e.message}`).join('; ') ??
              result.body.message ??
              `The server answered ${result.status}.`,
          );
      }}
    >
      {({ values, errors, submitCount, isSubmitting, setFieldValue, setValues }) => {
        return (
          <Form noValidate className="flex flex-col gap-4">
            {conflict ? (
              <ConflictBanner
                title="Someone else saved this rule while you were editing it. Nothing was overwritten."
                onTheirs={() => {
                  settle();
                  setValues(valuesOf(conflict));
                }}
                onMine={() => settle()}
              >
                <p>
                  Theirs: <span className="spec">{conflict.label}</span>, {conflict.kind},{' '}
                  {RULE_VEHICLE_CLASS_TEXT[conflict.vehicleClass ?? 'any']}, {conflict.items.length} item(s),{' '}
                  {conflict.active ? 'active' : 'switched off'}.
                </p>
              </ConflictBanner>
            ) : null}
            {problem ? (
              <Banner tone="fault" title="Not saved">
                {problem}
              </Banner>
            ) : null}
            <RadioGroup
              name="kind"
              legend="Which need does it price? (The advisor decides when a cam has it.)"
              options={NEED_RULE_KIND_OPTIONS.map((kind) => [kind, NEED_RULE_KIND_TEXT[kind].title] as const)}
              value={values.kind}
              onChange={(kind) => void setFieldValue('kind', kind)}
            />
            <SelectField
              name="vehicleClass"
              label="For which vehicles"
              className="max-w-xs"
              options={(['any', ...VEHICLE_CLASSES] as const).map((vc) => [vc, RULE_VEHICLE_CLASS_TEXT[vc]] as const)}
              hint="A rule for one class replaces the “every vehicle” rules of the same need for that class."
            />
            <TextField
              name="label"
              label="Label (what staff and customers read)"
              maxLength={NEED_RULE_LIMITS.labelMaxLength}
            />
            <CheckboxField name="active" label="Active (the advisor and quotes use it)" />
            <FieldArray name="items">
              {({ push, remove }) => (
                <fieldset className="flex flex-col gap-2">
                  <legend className="text-sm font-semibold">Then add</legend>
                  {values.items.map((item, index) => (
                    <div
                      key={index}
                      className="grid gap-2 rounded border border-steel-300 p-2 sm:grid-cols-[2fr_2fr_6rem_auto]"
                    >
                      <SelectField name={`items.${index}.partId`} label="Part" options={partOptions} />
                      <SelectField name={`items.${index}.laborOperationId`} label="Labour" options={laborOptions} />
                      <NumberField
                        name={`items.${index}.quantity`}
                        label="Quantity"
                        unit=""
                        range={NEED_RULE_LIMITS.quantity}
                        hint={`${NEED_RULE_LIMITS.quantity.min}–${NEED_RULE_LIMITS.quantity.max}`}
                      />
                      <button
                        type="button"
                        className="self-end text-xs text-fault-700 underline"
                        onClick={() => remove(index)}
                        disabled={values.items.length === 1}
                      >
                        Remove
                      </button>
                    </div>
                  ))}
                  {submitCount > 0 && typeof errors.items === 'string' ? (
                    <p className="text-xs text-fault-700">Problem: {errors.items}</p>
                  ) : null}
                  <Button
                    type="button"
                    variant="quiet"
                    className="self-start"
                    onClick={() => push({ partId: '', laborOperationId: '', quantity: '1' })}
                  >
                    Add another item
                  </Button>
                </fieldset>
              )}
            </FieldArray>
            <div>
              <Button type="submit" variant="primary" disabled={isSubmitting || Boolean(conflict)}>
                {isSubmitting ? 'Saving…' : rule ? 'Save rule' : 'Add rule'}
              </Button>
            </div>
          </Form>
        );
      }}
    </Formik>
  );
}

export function DeleteButton({ url, label, after }: { url: string; label: string; after: string }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-col gap-1">
      <Button
        type="button"
        variant="danger"
        onClick={async () => {
          if (!window.confirm(`${label}?`)) return;
          const result = await sendJson<{ outcome?: string }>('DELETE', url);
          if (result.status === 200) {
            router.push(`${after}?${result.body.outcome ?? 'deleted'}=1`);
            router.refresh();
          } else setMessage(result.body.message ?? `The server answered ${result.status}.`);
        }}
      >
        {label}
      </Button>
      {message ? (
        <span role="alert" className="text-xs text-fault-700">
          {message}
        </span>
      ) : null}
    </span>
  );
}
