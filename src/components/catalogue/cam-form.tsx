'use client';

import { useRouter } from 'next/navigation';
import { CATALOGUE_CAM_LIMITS as L } from '@/lib/schemas/catalogue-cam';
import { RecordForm, type FieldDef } from './generic-record-form';

const range = (r: { min: number; max: number }, unit: string) => `${r.min}–${r.max} ${unit}`;

export function camFields(suppliers: { id: number; name: string }[]): FieldDef[] {
  return [
    {
      name: 'sku',
      label: 'SKU',
      kind: 'text',
      hint: 'Letters, digits and . _ - / only.',
      required: true,
      maxLength: L.skuMaxLength,
    },
    { name: 'name', label: 'Name', kind: 'text', wide: true, required: true, maxLength: L.nameMaxLength },
    {
      name: 'supplierId',
      label: 'Supplier',
      kind: 'select',
      options: [
        { value: '', label: '(none: a reference card)' },
        ...suppliers.map((s) => ({ value: String(s.id), label: s.name })),
      ],
    },
    {
      name: 'intakeDuration050',
      label: 'Intake duration at 0.050"',
      kind: 'number',
      unit: 'deg',
      hint: range(L.duration050Deg, '°'),
      range: L.duration050Deg,
      required: true,
    },
    {
      name: 'exhaustDuration050',
      label: 'Exhaust duration at 0.050"',
      kind: 'number',
      unit: 'deg',
      hint: range(L.duration050Deg, '°'),
      range: L.duration050Deg,
      required: true,
    },
    {
      name: 'lsa',
      label: 'Lobe separation angle',
      kind: 'number',
      unit: 'deg',
      hint: range(L.lsaDeg, '°'),
      range: L.lsaDeg,
      required: true,
    },
    {
      name: 'intakeAdvertised',
      label: 'Intake advertised duration',
      kind: 'number',
      unit: 'deg',
      hint: `Optional; ${range(L.advertisedDeg, '°')}`,
      range: L.advertisedDeg,
    },
    {
      name: 'exhaustAdvertised',
      label: 'Exhaust advertised duration',
      kind: 'number',
      unit: 'deg',
      hint: `Optional; ${range(L.advertisedDeg, '°')}`,
      range: L.advertisedDeg,
    },
    {
      name: 'intakeCenterline',
      label: 'Installed intake centerline',
      kind: 'number',
      unit: 'deg ATDC',
      hint: range(L.intakeCenterlineDeg, '°'),
      range: L.intakeCenterlineDeg,
      required: true,
    },
    {
      name: 'intakeLiftIn',
      label: 'Intake lift at the valve',
      kind: 'number',
      unit: 'in',
      hint: range(L.liftIn, 'in'),
      range: L.liftIn,
      required: true,
    },
    {
      name: 'exhaustLiftIn',
      label: 'Exhaust lift at the valve',
      kind: 'number',
      unit: 'in',
      hint: range(L.liftIn, 'in'),
      range: L.liftIn,
      required: true,
    },
    {
      name: 'rockerRatio',
      label: 'Rocker ratio',
      kind: 'number',
      unit: ':1',
      hint: `Blank means ${L.rockerRatio.default}`,
      range: L.rockerRatio,
    },
    {
      name: 'springMaxLiftIn',
      label: 'Spring max lift',
      kind: 'number',
      unit: 'in',
      hint: 'Optional; for baseline cards',
      range: L.springMaxLiftIn,
    },
    { name: 'priceCents', label: 'Price', kind: 'money', unit: '$', range: L.priceCents, required: true },
    { name: 'costCents', label: 'Cost', kind: 'money', unit: '$', range: L.costCents },
    { name: 'stockOnHand', label: 'Stock on hand', kind: 'integer', unit: 'units', range: L.stockOnHand },
    { name: 'active', label: 'Active', kind: 'bool', hint: 'Offered by the advisor and on quotes.' },
    {
      name: 'emissionsCertified',
      label: 'Certified for emissions',
      kind: 'bool',
      hint: 'Its paperwork allows road use where emissions rules apply.',
    },
    {
      name: 'deactivationCompatible',
      label: 'Deactivation compatible',
      kind: 'bool',
      hint: 'Works with cylinder deactivation left active.',
    },
    {
      name: 'isFactoryBaseline',
      label: 'Factory baseline card',
      kind: 'bool',
      hint: 'A reference card for a stock engine, not for sale.',
    },
    {
      name: 'baselineForLiters',
      label: 'Baseline for displacement',
      kind: 'number',
      unit: 'L',
      hint: 'Only for a baseline card.',
      range: L.baselineForLiters,
    },
    { name: 'notes', label: 'Notes', kind: 'textarea', maxLength: L.notesMaxLength },
  ];
}

export function CamForm({
  cam,
  suppliers,
}: {
  cam: (Record<string, unknown> & { id: number; version: number }) | null;
  suppliers: { id: number; name: string }[];
}) {
  const router = useRouter();
  return (
    <RecordForm
      fields={camFields(suppliers)}
      record={cam}
      createUrl="/api/cams"
      updateUrl={cam ? `/api/cams/${cam.id}` : undefined}
      submitLabel={cam ? 'Save changes' : 'Add cam'}
      onSaved={(saved) => {
        router.push(`/catalogue/cams/${String(saved.id)}?saved=1`);
        router.refresh();
      }}
    />
  );
}
