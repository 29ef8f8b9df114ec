import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { StateTag } from '@/components/ui/state-tag';
import { tableClass, tdClass, thClass } from '@/components/ui/table';
import { requireAccessForPage } from '@/lib/auth/guard';
import { can } from '@/lib/auth/policy';
import { listBuilds } from '@/lib/db/queries/builds';
import { BuildListQuerySchema } from '@/lib/schemas/build';

export const metadata: Metadata = { title: 'Interviews' };

const USE_WORDS: Record<string, string> = { daily: 'Daily', towing: 'Towing', street: 'Street', strip: 'Strip' };

export default async function InterviewsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requireAccessForPage('builds.read');
  const raw = await searchParams;
  const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
  const parsed = BuildListQuerySchema.safeParse({ q: one(raw.q), page: one(raw.page), pageSize: '25' });
  const query = parsed.success ? parsed.data : BuildListQuerySchema.parse({});
  const { items, total } = await listBuilds(query);
  const writes = can(user, 'builds.write');
  const pages = Math.max(1, Math.ceil(total / query.pageSize));
  const pageHref = (page: number) =>
    `/interviews?${new URLSearchParams({ ...(query.q ? { q: query.q } : {}), page: String(page) })}`;

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Interviews"
        lead="Recent builds from the counter, newest first. Open one’s shortlist, or change what the customer told you."
        actions={
          writes ? (
            <ButtonLink href="/interviews/new" variant="primary">
              New interview
            </ButtonLink>
          ) : null
        }
      />
      <form method="get" action="/interviews" className="flex max-w-xl flex-wrap items-end gap-2" role="search">
        <label className="flex flex-1 flex-col gap-1 text-sm font-semibold">
          Search by customer name, phone, e-mail or vehicle
          <input
            name="q"
            type="search"
            defaultValue={query.q ?? ''}
            className="rounded border border-steel-300 bg-paper-raised px-3 py-2 font-normal"
          />
        </label>
        <button
          type="submit"
          className="rounded bg-paper-raised px-3 py-2 text-sm font-semibold ring-1 ring-steel-300 hover:ring-gauge-500"
        >
          Search
        </button>
      </form>
      {!parsed.success ? (
        <p className="text-sm text-fault-700">Problem: that search could not be read; showing the newest builds.</p>
      ) : null}
      <p className="text-sm text-ink-soft" aria-live="polite">
        {total === 1 ? '1 build' : `${total} builds`}
        {query.q ? ` matching “${query.q}”` : ''}
      </p>
      {/* relative: the header's screen-reader-only text is positioned absolutely and would otherwise widen the page on a phone. */}
      <div className="relative overflow-x-auto rounded-lg border border-steel-300 bg-paper-raised">
        <table className={tableClass}>
          <caption className="sr-only">Recent builds</caption>
          <thead>
            <tr>
              <th scope="col" className={thClass}>
                Saved
              </th>
              <th scope="col" className={thClass}>
                Customer
              </th>
              <th scope="col" className={thClass}>
                Vehicle
              </th>
              <th scope="col" className={thClass}>
                Use
              </th>
              <th scope="col" className={thClass}>
                Emissions
              </th>
              <th scope="col" className={thClass}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {items.map((b) => (
              <tr key={b.id}>
                <td className={`${tdClass} spec whitespace-nowrap`}>{b.updatedAt.slice(0, 10)}</td>
                <td className={tdClass}>
                  {b.customerName}
                  {b.customerPhone ? <span className="block text-xs text-ink-muted">{b.customerPhone}</span> : null}
                </td>
                <td className={tdClass}>{b.vehicleLabel}</td>
                <td className={tdClass}>{b.primaryUse ? (USE_WORDS[b.primaryUse] ?? b.primaryUse) : '—'}</td>
                <td className={tdClass}>
                  {b.emissionsRequired ? (
                    <StateTag tone="caution">Road-legal needed</StateTag>
                  ) : (
                    <StateTag tone="muted">Not needed</StateTag>
                  )}
                </td>
                <td className={`${tdClass} whitespace-nowrap`}>
                  <Link
                    href={`/advisor?build=${b.id}`}
                    className="font-semibold text-gauge-700 underline-offset-2 hover:underline"
                  >
                    Shortlist
                  </Link>
                  {writes ? (
                    <>
                      {' '}
                      ·{' '}
                      <Link
                        href={`/interviews/${b.id}/edit`}
                        className="text-gauge-700 underline-offset-2 hover:underline"
                      >
                        Edit
                      </Link>
                    </>
                  ) : null}
                </td>
              </tr>
            ))}
            {items.length === 0 ? (
              <tr>
                <td colSpan={6} className={`${tdClass} text-ink-soft`}>
                  No builds match.{' '}
                  {writes ? (
                    <Link href="/interviews/new" className="underline">
                      Start a new interview
                    </Link>
                  ) : null}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      {pages > 1 ? (
        <nav aria-label="Pages" className="flex items-center gap-3 text-sm">
          {query.page > 1 ? (
            <Link href={pageHref(query.page - 1)} className="underline">
              ← Newer
            </Link>
          ) : null}
          <span>
            Page {query.page} of {pages}
          </span>
          {query.page < pages ? (
            <Link href={pageHref(query.page + 1)} className="underline">
              Older →
            </Link>
          ) : null}
        </nav>
      ) : null}
    </div>
  );
}
