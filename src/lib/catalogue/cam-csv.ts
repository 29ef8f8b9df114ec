import type { SessionUser } from '@/lib/auth/guard';
import { camsBySku, commitCamImport, suppliersByName, type CamImportRow } from '@/lib/db/queries/cams';
import type { CamRecord } from './types';
import { formatZodIssues } from '@/lib/schemas/errors';
import { CatalogueCamSchema, type CatalogueCam } from '@/lib/schemas/catalogue-cam';
import { centsToDollars, convertCell, parseCsv, toCsv, type CsvCell, type CsvColumn } from './csv';
import type { WriteOutcome } from '@/lib/db/write';

// The cam spreadsheet: its columns (documented in docs/catalogue.md and in the template), the export,
// and the import's preview and commit. One row is one cam, matched to the catalogue by SKU.

type CamCsvField = keyof CatalogueCam | 'supplierName';

export const CAM_CSV_COLUMNS: CsvColumn<CamCsvField>[] = [
  {
    name: 'sku',
    field: 'sku',
    kind: 'text',
    required: true,
    help: 'The shop SKU; an existing SKU updates that cam, a new one adds a cam.',
    example: 'DM-214',
  },
  {
    name: 'name',
    field: 'name',
    kind: 'text',
    required: true,
    help: 'Grind name as the counter says it.',
    example: 'Demo Mill Street 214',
  },
  {
    name: 'supplier',
    field: 'supplierName',
    kind: 'text',
    help: 'Supplier name; a name not yet known is added as a new supplier.',
    example: 'Ridgeback Grind Co.',
  },
  {
    name: 'intake_duration_050',
    field: 'intakeDuration050',
    kind: 'number',
    required: true,
    help: 'Intake duration at 0.050" tappet lift, crank degrees.',
    example: '214',
  },
  {
    name: 'exhaust_duration_050',
    field: 'exhaustDuration050',
    kind: 'number',
    required: true,
    help: 'Exhaust duration at 0.050" tappet lift, crank degrees.',
    example: '220',
  },
  {
    name: 'intake_advertised',
    field: 'intakeAdvertised',
    kind: 'number',
    help: 'Advertised (seat) intake duration, degrees; blank if not printed.',
    example: '266',
  },
  {
    name: 'exhaust_advertised',
    field: 'exhaustAdvertised',
    kind: 'number',
    help: 'Advertised (seat) exhaust duration, degrees.',
    example: '272',
  },
  {
    name: 'intake_lift_in',
    field: 'intakeLiftIn',
    kind: 'number',
    required: true,
    help: 'Intake lift at the valve, inches.',
    example: '0.570',
  },
  {
    name: 'exhaust_lift_in',
    field: 'exhaustLiftIn',
    kind: 'number',
    required: true,
    help: 'Exhaust lift at the valve, inches.',
    example: '0.570',
  },
  {
    name: 'lsa',
    field: 'lsa',
    kind: 'number',
    required: true,
    help: 'Lobe separation angle, cam degrees.',
    example: '113',
  },
  {
    name: 'intake_centerline',
    field: 'intakeCenterline',
    kind: 'number',
    required: true,
    help: 'Installed intake centerline, crank degrees ATDC.',
    example: '109',
  },
  {
    name: 'rocker_ratio',
    field: 'rockerRatio',
    kind: 'number',
    help: 'Rocker ratio the lifts are quoted at; blank means 1.7.',
    example: '1.7',
  },
  {
    name: 'spring_max_lift_in',
    field: 'springMaxLiftIn',
    kind: 'number',
    help: 'Most lift the factory springs for this card take, inches (baseline cards).',
    example: '',
  },
  {
    name: 'price',
    field: 'priceCents',
    kind: 'money',
    required: true,
    help: 'Selling price in dollars and cents.',
    example: '419.00',
  },
  {
    name: 'cost',
    field: 'costCents',
    kind: 'money',
    help: 'What the shop pays, dollars and cents; blank means 0.',
    example: '260.00',
  },
  {
    name: 'stock_on_hand',
    field: 'stockOnHand',
    kind: 'integer',
    help: 'Units on the shelf; blank means 0.',
    example: '3',
  },
  {
    name: 'active',
    field: 'active',
    kind: 'boolean',
    help: 'yes/no: offered by the advisor; blank means yes.',
    example: 'yes',
  },
  {
    name: 'emissions_certified',
    field: 'emissionsCertified',
    kind: 'boolean',
    help: 'yes/no: certified for road use where emissions rules apply.',
    example: 'no',
  },
  {
    name: 'deactivation_compatible',
    field: 'deactivationCompatible',
    kind: 'boolean',
    help: 'yes/no: works with cylinder deactivation left active.',
    example: 'no',
  },
  {
    name: 'factory_baseline',
    field: 'isFactoryBaseline',
    kind: 'boolean',
    help: 'yes/no: a factory-style reference card, not for sale.',
    example: 'no',
  },
  {
    name: 'baseline_for_liters',
    field: 'baselineForLiters',
    kind: 'number',
    help: 'For a baseline card: the displacement it stands for, litres.',
    example: '',
  },
  {
    name: 'notes',
    field: 'notes',
    kind: 'text',
    help: 'Anything the counter should know.',
    example: 'Likes a 2,800 rpm converter.',
  },
];

/** Written by the export for information; ignored by the import. */
export const CAM_CSV_EXPORT_ONLY = ['archived'] as const;

export function camTemplateCsv(): string {
  return toCsv(
    CAM_CSV_COLUMNS.map((c) => c.name),
    [CAM_CSV_COLUMNS.map((c) => c.example)],
  );
}

export function camsToCsv(cams: CamRecord[], options: { includeCosts: boolean }): string {
  const columns = CAM_CSV_COLUMNS.filter((c) => options.includeCosts || c.field !== 'costCents');
  const rows: CsvCell[][] = cams.map((cam) => [
    ...columns.map((c): CsvCell => {
      if (c.field === 'supplierName') return cam.supplierName;
      const value = cam[c.field as keyof CamRecord];
      if (c.kind === 'money') return centsToDollars(value as number);
      return value as CsvCell;
    }),
    cam.archivedAt ? 'yes' : 'no',
  ]);
  return toCsv([...columns.map((c) => c.name), ...CAM_CSV_EXPORT_ONLY], rows);
}

export type ImportIssue = { row: number; column: string; field: string; message: string };
export type ImportRowReport = {
  row: number;
  sku: string;
  name: string;
  action: 'create' | 'update' | 'unchanged' | 'error';
  changes: { field: string; column: string; from: unknown; to: unknown }[];
  errors: { column: string; message: string }[];
};
export type ImportReport = {
  rowCount: number;
  columns: string[];
  ignoredColumns: string[];
  summary: { create: number; update: number; unchanged: number; error: number };
  suppliersToAdd: string[];
  rows: ImportRowReport[];
  errors: ImportIssue[];
};

const columnForField = new Map(CAM_CSV_COLUMNS.map((c) => [c.field as string, c.name]));
const MAX_ROWS = 20_000;

/** Reads and checks every row without writing anything: what would be created, updated, and every error. */
export async function previewCamImport(text: string): Promise<{ report: ImportReport; plan: CamImportRow[] }> {
  const parsed = parseCsv(text);
  const known = new Set(CAM_CSV_COLUMNS.map((c) => c.name));
  const ignoredColumns = parsed.header.filter(
    (h) => h && !known.has(h) && !(CAM_CSV_EXPORT_ONLY as readonly string[]).includes(h),
  );
  const errors: ImportIssue[] = parsed.errors.map((e) => ({ ...e, field: '(row)' }));
  const missing = CAM_CSV_COLUMNS.filter((c) => c.required && !parsed.header.includes(c.name));
  for (const column of missing)
    errors.push({
      row: 1,
      column: column.name,
      field: column.field,
      message: `the header row has no "${column.name}" column`,
    });
  if (parsed.rows.length === 0 && !missing.length)
    errors.push({ row: 2, column: '(row)', field: '(row)', message: 'the file has a header row but no cams' });
  if (parsed.rows.length > MAX_ROWS)
    errors.push({
      row: MAX_ROWS + 2,
      column: '(row)',
      field: '(row)',
      message: `a file may hold at most ${MAX_ROWS} cams`,
    });

  const skus = parsed.rows.map((r) => r.cells.sku ?? '').filter(Boolean);
  const existing = missing.length ? new Map<string, CamRecord>() : await camsBySku(skus);
  const suppliers = await suppliersByName();
  const suppliersToAdd = new Map<string, string>();
  const seenSku = new Map<string, number>();
  const rows: ImportRowReport[] = [];
  const plan: CamImportRow[] = [];

  for (const { row, cells } of missing.length ? [] : parsed.rows.slice(0, MAX_ROWS)) {
    const rowErrors: { column: string; message: string }[] = [];
    const input: Record<string, unknown> = {};
    for (const column of CAM_CSV_COLUMNS) {
      if (!(column.name in cells)) continue;
      const converted = convertCell(cells[column.name], column.kind);
      if (converted.ok) input[column.field] = converted.value;
      else rowErrors.push({ column: column.name, message: converted.message });
    }
    const supplierName = typeof input.supplierName === 'string' ? input.supplierName : null;
    delete input.supplierName;
    const sku = String(input.sku ?? '');
    const key = sku.toLowerCase();
    if (sku && seenSku.has(key))
      rowErrors.push({ column: 'sku', message: `SKU ${sku} is already on row ${seenSku.get(key)} of this file` });
    else if (sku) seenSku.set(key, row);

    const current = existing.get(key) ?? null;
    // Columns left out of the file keep the stored value on an update.
    const base = current
      ? Object.fromEntries(
          CAM_CSV_COLUMNS.filter((c) => c.field !== 'supplierName' && !(c.name in cells)).map((c) => [
            c.field,
            current[c.field as keyof CamRecord],
          ]),
        )
      : {};
    const parsedRow = CatalogueCamSchema.safeParse({ ...base, ...input, supplierId: null });
    if (!parsedRow.success) {
      for (const issue of formatZodIssues(parsedRow.error)) {
        const column = columnForField.get(issue.field) ?? issue.field;
        if (!rowErrors.some((e) => e.column === column)) rowErrors.push({ column, message: issue.message });
      }
    }
    if (supplierName && !suppliers.has(supplierName.toLowerCase()))
      suppliersToAdd.set(supplierName.toLowerCase(), supplierName);

    const report: ImportRowReport = {
      row,
      sku,
      name: String(input.name ?? current?.name ?? ''),
      action: 'error',
      changes: [],
      errors: rowErrors,
    };
    if (!rowErrors.length && parsedRow.success) {
      const { supplierId: _unused, ...values } = parsedRow.data;
      void _unused;
      const effectiveSupplier = 'supplier' in cells ? supplierName : (current?.supplierName ?? null);
      plan.push({ values, supplierName: effectiveSupplier, existing: current });
      if (!current) report.action = 'create';
      else {
        for (const column of CAM_CSV_COLUMNS) {
          const from =
            column.field === 'supplierName' ? current.supplierName : current[column.field as keyof CamRecord];
          const to =
            column.field === 'supplierName'
              ? effectiveSupplier
              : ((values as Record<string, unknown>)[column.field] ?? null);
          const same =
            column.field === 'supplierName'
              ? (from ?? '').toString().toLowerCase() === (to ?? '').toString().toLowerCase()
              : JSON.stringify(from ?? null) === JSON.stringify(to ?? null);
          if (!same)
            report.changes.push({ field: column.field, column: column.name, from: from ?? null, to: to ?? null });
        }
        report.action = report.changes.length ? 'update' : 'unchanged';
      }
    }
    for (const e of rowErrors)
      errors.push({
        row,
        column: e.column,
        field: CAM_CSV_COLUMNS.find((c) => c.name === e.column)?.field ?? e.column,
        message: e.message,
      });
    rows.push(report);
  }

  const summary = { create: 0, update: 0, unchanged: 0, error: 0 };
  for (const r of rows) summary[r.action] += 1;
  return {
    report: {
      rowCount: parsed.rows.length,
      columns: parsed.header,
      ignoredColumns,
      summary,
      suppliersToAdd: [...suppliersToAdd.values()],
      rows,
      errors,
    },
    plan,
  };
}

export async function commitCams(
  plan: CamImportRow[],
  user: SessionUser,
): Promise<WriteOutcome<{ created: number; updated: number; unchanged: number; suppliersAdded: string[] }>> {
  return commitCamImport(plan, user);
}
