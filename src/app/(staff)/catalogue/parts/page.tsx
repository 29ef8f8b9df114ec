import type { Metadata } from 'next';
import Link from 'next/link';
import { formatMoney } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { StateTag } from '@/components/ui/state-tag';
import { tableClass, tdClass, thClass } from '@/components/ui/table';
import { requireAccessForPage } from '@/lib/auth/guard';
import { canSeeCosts } from '@/lib/auth/costs';
import { can } from '@/lib/auth/policy';
import { listParts } from '@/lib/db/queries/parts';
import { PART_CATEGORY_LIST, PartListQuerySchema } from '@/lib/schemas/part';

export const metadata: Metadata = { title: 'Parts' };

export default async function PartsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  const user = await requireAccessForPage('catalogue.read');
  const raw = await searchParams;
  const parsed = PartListQuerySchema.safeParse({
    category: raw.category || undefined,
    q: raw.q || undefined,
    pageSize: '200',
    sort: raw.sort || undefined,
    dir: raw.dir || undefined,
  });
  const query = parsed.success ? parsed.data : PartListQuerySchema.parse({ pageSize: '200' });
  const { items, total } = await listParts(query);
  const manager = can(user, 'catalogue.write');
  const costs = canSeeCosts(user);
  const link = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(Object.entries({ ...raw, ...changes }).filter(([, v]) => v) as [string, string][]);
    next.delete('saved');
    return `?${next}`;
  };
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Parts"
        lead="What a cam swap can need besides the cam."
        back={{ href: '/catalogue', label: 'Catalogue' }}
        actions={
          manager ? (
            <ButtonLink href="/catalogue/parts/new" variant="primary">
              Add a part
            </ButtonLink>
          ) : null
        }
      />
      {raw.saved ? <Banner tone="ok" title="Part saved" /> : null}
      {raw.deleted ? <Banner tone="ok" title="Part deleted" /> : null}
      {raw.deactivated ? (
        <Banner tone="info" title="Part switched off">
          Quotes refer to it, so it was kept and made inactive instead of deleted.
        </Banner>
      ) : null}
      <nav aria-label="Categories" className="flex flex-wrap gap-2 text-sm">
        <Link
          href={link({ category: undefined })}
          aria-current={!query.category ? 'page' : undefined}
          className={`rounded px-2 py-1 ring-1 ring-steel-300 ${!query.category ? 'bg-ink text-paper' : 'bg-paper-raised'}`}
        >
          all
        </Link>
        {PART_CATEGORY_LIST.map((c) => (
          <Link
            key={c}
            href={link({ category: c })}
            aria-current={query.category === c ? 'page' : undefined}
            className={`rounded px-2 py-1 ring-1 ring-steel-300 ${query.category === c ? 'bg-ink text-paper' : 'bg-paper-raised'}`}
          >
            {c}
          </Link>
        ))}
      </nav>
      <form className="flex gap-2" role="search">
        {query.category ? <input type="hidden" name="category" value={query.category} /> : null}
        <label className="sr-only" htmlFor="parts-q">
          Search parts
        </label>
        <input
          id="parts-q"
          name="q"
          type="search"
          defaultValue={raw.q ?? ''}
          placeholder="SKU or name"
          className="rounded border border-steel-300 bg-paper-raised px-2 py-1 text-sm"
        />
        <button type="submit" className="rounded bg-paper-raised px-3 py-1 text-sm font-semibold ring-1 ring-steel-300">
          Search
        </button>
      </form>
      <div className="overflow-x-auto rounded border border-steel-300 bg-paper-raised">
        <table className={tableClass}>
          <thead>
            <tr>
              {[
                ['sku', 'SKU'],
                ['name', 'Name'],
                ['category', 'Category'],
              ].map(([key, label]) => (
                <th
                  key={key}
                  className={thClass}
                  aria-sort={query.sort === key ? (query.dir === 'asc' ? 'ascending' : 'descending') : undefined}
                >
                  <Link href={link({ sort: key, dir: query.sort === key && query.dir === 'asc' ? 'desc' : 'asc' })}>
                    {label}
                  </Link>
                </th>
              ))}
              <th className={thClass}>Supplier</th>
              <th className={`${thClass} text-right`}>
                <Link
                  href={link({
                    sort: 'priceCents',
                    dir: query.sort === 'priceCents' && query.dir === 'asc' ? 'desc' : 'asc',
                  })}
                >
                  Price
                </Link>
              </th>
              {costs ? <th className={`${thClass} text-right`}>Cost</th> : null}
              <th className={`${thClass} text-right`}>
                <Link
                  href={link({
                    sort: 'stockOnHand',
                    dir: query.sort === 'stockOnHand' && query.dir === 'asc' ? 'desc' : 'asc',
                  })}
                >
                  Stock
                </Link>
              </th>
              <th className={thClass}>State</th>
              {manager ? (
                <th className={thClass}>
                  <span className="sr-only">Actions</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {items.map((p) => (
              <tr key={p.id}>
                <td className={`${tdClass} spec`}>{p.sku}</td>
                <td className={tdClass}>
                  {p.name}
                  {p.spec ? (
                    <span className="spec block text-xs text-ink-muted">
                      {Object.entries(p.spec)
                        .map(([k, v]) => `${k} ${String(v)}`)
                        .join(' · ')}
                    </span>
                  ) : null}
                </td>
                <td className={tdClass}>{p.category}</td>
                <td className={tdClass}>{p.supplierName ?? '—'}</td>
                <td className={`${tdClass} spec text-right`}>{formatMoney(p.priceCents)}</td>
                {costs ? <td className={`${tdClass} spec text-right`}>{formatMoney(p.costCents)}</td> : null}
                <td className={`${tdClass} spec text-right`}>{p.stockOnHand}</td>
                <td className={tdClass}>
                  {p.active ? <StateTag tone="ok">Active</StateTag> : <StateTag tone="caution">Inactive</StateTag>}
                </td>
                {manager ? (
                  <td className={tdClass}>
                    <Link className="text-gauge-700 underline" href={`/catalogue/parts/${p.id}/edit`}>
                      Edit
                    </Link>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
        {items.length === 0 ? <p className="p-4 text-sm text-ink-soft">No parts match.</p> : null}
      </div>
      <p className="text-xs text-ink-muted tabular-nums">{total} part(s)</p>
    </div>
  );
}
