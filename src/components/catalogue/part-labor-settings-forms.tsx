'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { CATALOGUE_CAM_LIMITS as CAM } from '@/lib/schemas/catalogue-cam';
import { LABOR_LIMITS } from '@/lib/schemas/labor';
import { PART_CATEGORY_LIST, PART_LIMITS } from '@/lib/schemas/part';
import { SETTINGS_LIMITS } from '@/lib/schemas/settings';
import { AIR_UNITS, AIR_UNITS_WORDS } from '@/lib/dyno/units';
import { RecordForm, type FieldDef } from './generic-record-form';
import { Banner } from '@/components/ui/banner';

type Rec = (Record<string, unknown> & { id: number; version: number }) | null;

export function PartForm({ part, suppliers }: { part: Rec; suppliers: { id: number; name: string }[] }) {
  const router = useRouter();
  const fields: FieldDef[] = [
    { name: 'sku', label: 'SKU', kind: 'text', required: true, maxLength: CAM.skuMaxLength },
    { name: 'name', label: 'Name', kind: 'text', wide: true, required: true, maxLength: PART_LIMITS.nameMaxLength },
    {
      name: 'category',
      label: 'Category',
      kind: 'select',
      options: PART_CATEGORY_LIST.map((c) => ({ value: c, label: c })),
    },
    {
      name: 'supplierId',
      label: 'Supplier',
      kind: 'select',
      options: [{ value: '', label: '(none)' }, ...suppliers.map((s) => ({ value: String(s.id), label: s.name }))],
    },
    { name: 'priceCents', label: 'Price', kind: 'money', unit: '$', range: CAM.priceCents, required: true },
    { name: 'costCents', label: 'Cost', kind: 'money', unit: '$', range: CAM.costCents },
    { name: 'stockOnHand', label: 'Stock on hand', kind: 'integer', unit: 'units', range: CAM.stockOnHand },
    { name: 'active', label: 'Active', kind: 'bool', hint: 'Offered on quotes and by rules.' },
    { name: 'notes', label: 'Notes', kind: 'textarea', maxLength: CAM.notesMaxLength },
  ];
  return (
    <RecordForm
      fields={fields}
      record={part}
      createUrl="/api/parts"
      updateUrl={part ? `/api/parts/${part.id}` : undefined}
      submitLabel={part ? 'Save changes' : 'Add part'}
      extraPayload={part ? { spec: part.spec ?? null } : {}}
      onSaved={() => {
        router.push('/catalogue/parts?saved=1');
        router.refresh();
      }}
    />
  );
}

export function LaborForm({ labor }: { labor: Rec }) {
  const router = useRouter();
  const fields: FieldDef[] = [
    { name: 'code', label: 'Code', kind: 'text', required: true, maxLength: CAM.skuMaxLength },
    { name: 'name', label: 'Name', kind: 'text', wide: true, required: true, maxLength: LABOR_LIMITS.nameMaxLength },
    {
      name: 'hours',
      label: 'Hours',
      kind: 'number',
      unit: 'h',
      hint: `${LABOR_LIMITS.hours.min}–${LABOR_LIMITS.hours.max} h, two decimals at most`,
      range: LABOR_LIMITS.hours,
      required: true,
    },
    {
      name: 'engines',
      label: 'Engines',
      kind: 'text',
      hint: '"all", or a comma list such as truck, car, 6.2',
      maxLength: LABOR_LIMITS.enginesMaxLength,
    },
    { name: 'active', label: 'Active', kind: 'bool' },
  ];
  return (
    <RecordForm
      fields={fields}
      record={labor}
      createUrl="/api/labor"
      updateUrl={labor ? `/api/labor/${labor.id}` : undefined}
      submitLabel={labor ? 'Save changes' : 'Add labour operation'}
      onSaved={() => {
        router.push('/catalogue/labor?saved=1');
        router.refresh();
      }}
    />
  );
}

export function SettingsForm({ settings }: { settings: Rec }) {
  const router = useRouter();
  const [saved, setSaved] = useState(false);
  const S = SETTINGS_LIMITS;
  const fields: FieldDef[] = [
    { name: 'name', label: 'Shop name', kind: 'text', wide: true, required: true, maxLength: S.nameMaxLength },
    { name: 'address', label: 'Address', kind: 'text', wide: true },
    { name: 'phone', label: 'Phone', kind: 'text' },
    { name: 'email', label: 'E-mail', kind: 'text' },
    {
      name: 'laborRateCents',
      label: 'Labour rate',
      kind: 'money',
      unit: '$ per hour',
      range: S.laborRateCents,
      required: true,
    },
    {
      name: 'taxRateBp',
      label: 'Tax rate',
      kind: 'percent',
      unit: '%',
      hint: `e.g. 8.25; ${S.taxRateBp.min / 100}–${S.taxRateBp.max / 100} %`,
      range: S.taxRateBp,
      required: true,
    },
    {
      name: 'depositPercentBp',
      label: 'Deposit',
      kind: 'percent',
      unit: '% of the total',
      hint: 'e.g. 20',
      range: S.depositPercentBp,
      required: true,
      term: 'deposit percent',
    },
    {
      name: 'maxCounterDiscountBp',
      label: 'Counter staff may discount up to',
      kind: 'percent',
      unit: '% of the job',
      hint: 'more waits for a manager to approve it before the quote can be sent; a price change needs a manager',
      range: S.depositPercentBp,
      required: true,
      term: 'counter discount limit',
    },
    {
      name: 'depositMinCents',
      label: 'Deposit minimum',
      kind: 'money',
      unit: '$',
      range: S.depositCents,
      required: true,
    },
    {
      name: 'depositMaxCents',
      label: 'Deposit maximum',
      kind: 'money',
      unit: '$',
      range: S.depositCents,
      required: true,
    },
    {
      name: 'depositPolicyText',
      label: 'Deposit policy (shown to the customer before paying)',
      kind: 'textarea',
      required: true,
      maxLength: S.policyMaxLength,
      term: 'deposit policy',
    },
    {
      name: 'leadStaleDays',
      label: 'Flag a new lead nobody has contacted after',
      kind: 'integer',
      unit: 'days',
      hint: `${S.leadStaleDays.min}–${S.leadStaleDays.max}; a note, or moving it past New, counts as contact`,
      range: S.leadStaleDays,
      term: 'days before a lead is flagged',
    },
    {
      name: 'dynoAirUnits',
      label: 'Dyno air conditions in',
      kind: 'select',
      options: AIR_UNITS.map((u) => ({ value: u, label: AIR_UNITS_WORDS[u] })),
      hint: 'how the job page asks for and shows the dyno cell’s air; runs are stored in °C and kPa either way',
      term: 'dyno air units',
    },
  ];
  return (
    <div className="flex flex-col gap-3">
      {saved ? (
        <Banner tone="ok" title="Settings saved">
          New quotes use these figures from now on; quotes already sent keep theirs.
        </Banner>
      ) : null}
      <RecordForm
        fields={fields}
        record={settings}
        updateUrl="/api/settings"
        submitLabel="Save settings"
        onSaved={() => {
          setSaved(true);
          router.refresh();
        }}
      />
    </div>
  );
}
