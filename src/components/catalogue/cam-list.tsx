'use client';

import Link from 'next/link';
import { useRouter, useSearchParams } from 'next/navigation';
import { useEffect, useState } from 'react';
import useSWR from 'swr';
import type { CamRecord } from '@/lib/catalogue/types';
import { getJson, type ApiError } from '@/lib/api-client';
import { deg, formatMoney, inches } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { StateTag } from '@/components/ui/state-tag';
import { tableClass, tdClass, thClass } from '@/components/ui/table';

// The cam list: filters and sort live in the address (so a filtered list can be shared and the back
// button works), the server does the paging, SWR keeps the previous page on screen while the next loads.
type Page = { items: (CamRecord & { costCents?: number })[]; total: number; page: number; pageSize: number };

const FILTERS = [
  'q',
  'supplier',
  'durationMin',
  'durationMax',
  'lsaMin',
  'lsaMax',
  'active',
  'inStock',
  'archived',
] as const;

const COLUMNS: { key: string; label: string; sort?: string; numeric?: boolean }[] = [
  { key: 'sku', label: 'SKU', sort: 'sku' },
  { key: 'name', label: 'Name', sort: 'name' },
  { key: 'supplier', label: 'Supplier', sort: 'supplier' },
  { key: 'dur', label: 'Dur. @0.050" in/ex', sort: 'intakeDuration050', numeric: true },
  { key: 'lift', label: 'Lift in/ex', sort: 'intakeLiftIn', numeric: true },
  { key: 'lsa', label: 'LSA', sort: 'lsa', numeric: true },
  { key: 'price', label: 'Price', sort: 'priceCents', numeric: true },
  { key: 'stock', label: 'Stock', sort: 'stockOnHand', numeric: true },
  { key: 'state', label: 'State' },
];

export function CamList({ suppliers, canEdit }: { suppliers: { id: number; name: string }[]; canEdit: boolean }) {
  const router = useRouter();
  const params = useSearchParams();
  const [draft, setDraft] = useState(
    () => Object.fromEntries(FILTERS.map((f) => [f, params.get(f) ?? ''])) as Record<(typeof FILTERS)[number], string>,
  );
  const query = new URLSearchParams();
  for (const [k, v] of params.entries()) if (v) query.set(k, v);
  if (!query.has('pageSize')) query.set('pageSize', '25');
  const { data, error, isLoading, isValidating } = useSWR<Page, ApiError>(`/api/cams?${query}`, getJson, {
    keepPreviousData: true,
  });

  // Typing in the search box filters after a short pause, without a button.
  useEffect(() => {
    const timer = setTimeout(() => {
      if ((params.get('q') ?? '') !== draft.q) apply({ q: draft.q });
    }, 300);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [draft.q]);

  function apply(changes: Record<string, string>, resetPage = true) {
    const next = new URLSearchParams(params.toString());
    for (const [k, v] of Object.entries(changes)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    if (resetPage && !('page' in changes)) next.delete('page');
    router.replace(`?${next}`, { scroll: false });
  }

  const sort = params.get('sort') ?? 'intakeDuration050';
  const dir = params.get('dir') ?? 'asc';
  const page = Number(params.get('page') ?? '1');
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  const input = 'w-full rounded border border-steel-300 bg-paper-raised px-2 py-1 text-sm';
  return (
    <div className="flex flex-col gap-4">
      <form
        className="grid gap-2 rounded border border-steel-300 bg-paper-sunk p-3 sm:grid-cols-3 lg:grid-cols-6"
        onSubmit={(e) => {
          e.preventDefault();
          apply(draft);
        }}
        aria-label="Filter cams"
      >
        <label className="flex flex-col gap-1 text-xs font-semibold sm:col-span-2">
          Search SKU or name
          <input
            type="search"
            className={input}
            value={draft.q}
            onChange={(e) => setDraft({ ...draft, q: e.target.value })}
            placeholder="e.g. 212 or Tow"
          />
        </label>
        <label className="flex flex-col gap-1 text-xs font-semibold">
          Supplier
          <select
            className={input}
            value={draft.supplier}
            onChange={(e) => {
              setDraft({ ...draft, supplier: e.target.value });
              apply({ supplier: e.target.value });
            }}
          >
            <option value="">All suppliers</option>
            {suppliers.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </label>
        <fieldset className="flex flex-col gap-1 text-xs font-semibold">
          <legend>Intake dur. @0.050&quot; (°)</legend>
          <div className="flex gap-1">
            <input
              aria-label="Shortest intake duration"
              inputMode="decimal"
              className={`${input} spec`}
              value={draft.durationMin}
              onChange={(e) => setDraft({ ...draft, durationMin: e.target.value })}
              placeholder="from"
            />
            <input
              aria-label="Longest intake duration"
              inputMode="decimal"
              className={`${input} spec`}
              value={draft.durationMax}
              onChange={(e) => setDraft({ ...draft, durationMax: e.target.value })}
              placeholder="to"
            />
          </div>
        </fieldset>
        <fieldset className="flex flex-col gap-1 text-xs font-semibold">
          <legend>LSA (°)</legend>
          <div className="flex gap-1">
            <input
              aria-label="Narrowest LSA"
              inputMode="decimal"
              className={`${input} spec`}
              value={draft.lsaMin}
              onChange={(e) => setDraft({ ...draft, lsaMin: e.target.value })}
              placeholder="from"
            />
            <input
              aria-label="Widest LSA"
              inputMode="decimal"
              className={`${input} spec`}
              value={draft.lsaMax}
              onChange={(e) => setDraft({ ...draft, lsaMax: e.target.value })}
              placeholder="to"
            />
          </div>
        </fieldset>
        <div className="flex flex-col gap-1 text-xs font-semibold">
          <span>Show</span>
          <div className="flex flex-wrap gap-2 font-normal">
            <label className="flex items-center gap-1">
              <input
                type="checkbox"
                checked={draft.active === 'true'}
                onChange={(e) => {
                  const v = e.target.checked ? 'true' : '';
                  setDraft({ ...draft, active: v });
                  apply({ active: v });
                }}
              />
              active only
            </label>
            <label className="flex items-center gap-1">
              <input
                type="checkbox"
                checked={draft.inStock === 'true'}
                onChange={(e) => {
                  const v = e.target.checked ? 'true' : '';
                  setDraft({ ...draft, inStock: v });
                  apply({ inStock: v });
                }}
              />
              in stock
            </label>
            <label className="flex items-center gap-1">
              <input
                type="checkbox"
                checked={draft.archived === 'only'}
                onChange={(e) => {
                  const v = e.target.checked ? 'only' : '';
                  setDraft({ ...draft, archived: v });
                  apply({ archived: v });
                }}
              />
              archived
            </label>
          </div>
        </div>
        <div className="flex items-end gap-2 sm:col-span-3 lg:col-span-6">
          <Button type="submit" variant="quiet">
            Apply filters
          </Button>
          <Button
            type="button"
            variant="quiet"
            onClick={() => {
              setDraft(Object.fromEntries(FILTERS.map((f) => [f, ''])) as typeof draft);
              router.replace('?', { scroll: false });
            }}
          >
            Clear
          </Button>
          <span className="ml-auto text-xs text-ink-muted" aria-live="polite">
            {isLoading
              ? 'Loading cams…'
              : isValidating
                ? 'Updating…'
                : data
                  ? `${data.total} cam${data.total === 1 ? '' : 's'}`
                  : ''}
          </span>
        </div>
      </form>

      {error ? (
        <Banner tone="fault" title="The cam list could not be loaded">
          {error.status === 422
            ? (error.body.errors ?? []).map((e) => `${e.field}: ${e.message}`).join('; ')
            : error.message}
        </Banner>
      ) : null}

      <div className="overflow-x-auto rounded border border-steel-300 bg-paper-raised">
        <table className={tableClass}>
          <thead>
            <tr>
              {COLUMNS.map((c) => (
                <th
                  key={c.key}
                  scope="col"
                  className={`${thClass} ${c.numeric ? 'text-right' : ''}`}
                  aria-sort={c.sort === sort ? (dir === 'asc' ? 'ascending' : 'descending') : undefined}
                >
                  {c.sort ? (
                    <button
                      type="button"
                      className="uppercase hover:text-ink"
                      onClick={() => apply({ sort: c.sort!, dir: c.sort === sort && dir === 'asc' ? 'desc' : 'asc' })}
                    >
                      {c.label}
                      {c.sort === sort ? <span aria-hidden> {dir === 'asc' ? '▲' : '▼'}</span> : null}
                    </button>
                  ) : (
                    c.label
                  )}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {data?.items.map((cam) => (
              <tr key={cam.id} className="hover:bg-paper-sunk">
                <td className={`${tdClass} spec`}>
                  <Link
                    href={`/catalogue/cams/${cam.id}`}
                    className="font-semibold text-gauge-700 underline-offset-2 hover:underline"
                  >
                    {cam.sku}
                  </Link>
                </td>
                <td className={tdClass}>{cam.name}</td>
                <td className={tdClass}>
                  {cam.supplierName ?? <span className="text-ink-muted">reference card</span>}
                </td>
                {/* Intake / exhaust pairs read as one value: never broken over two lines. */}
                <td className={`${tdClass} spec whitespace-nowrap text-right`}>
                  {deg(cam.intakeDuration050)} / {deg(cam.exhaustDuration050)}
                </td>
                <td className={`${tdClass} spec whitespace-nowrap text-right`}>
                  {inches(cam.intakeLiftIn)} / {inches(cam.exhaustLiftIn)}
                </td>
                <td className={`${tdClass} spec text-right`}>{deg(cam.lsa)}</td>
                <td className={`${tdClass} spec text-right`}>{formatMoney(cam.priceCents)}</td>
                <td className={`${tdClass} spec text-right`}>{cam.stockOnHand}</td>
                <td className={tdClass}>
                  {cam.archivedAt ? (
                    <StateTag tone="muted">Archived</StateTag>
                  ) : cam.active ? (
                    <StateTag tone="ok">Active</StateTag>
                  ) : (
                    <StateTag tone="caution">Inactive</StateTag>
                  )}{' '}
                  {cam.stockOnHand <= 0 && !cam.isFactoryBaseline ? (
                    <StateTag tone="caution">None in stock</StateTag>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {data && data.items.length === 0 ? (
          <p className="p-4 text-sm text-ink-soft">
            No cams match these filters.{' '}
            {canEdit
              ? 'Clear the filters, add a cam, or import a supplier’s spreadsheet.'
              : 'Clear the filters to see the whole catalogue.'}
          </p>
        ) : null}
        {!data && isLoading ? <p className="p-4 text-sm text-ink-soft">Loading cams…</p> : null}
      </div>

      <nav aria-label="Pages" className="flex items-center gap-2 text-sm">
        <Button
          type="button"
          variant="quiet"
          disabled={page <= 1}
          onClick={() => apply({ page: String(page - 1) }, false)}
        >
          ← Previous
        </Button>
        <span className="tabular-nums">
          Page {page} of {pages}
        </span>
        <Button
          type="button"
          variant="quiet"
          disabled={page >= pages}
          onClick={() => apply({ page: String(page + 1) }, false)}
        >
          Next →
        </Button>
      </nav>
    </div>
  );
}
