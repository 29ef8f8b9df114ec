import type { Metadata } from 'next';
import Link from 'next/link';
import { formatMoney } from '@/lib/format';
import { Button, ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { tableClass, tdClass, thClass } from '@/components/ui/table';
import { PaymentStatusTag, QuoteStatusTag, quoteStatusWord } from '@/components/quotes/status';
import { requireAccessForPage } from '@/lib/auth/guard';
import { QUOTE_STATUSES, type QuoteStatus } from '@/lib/db/models/quote';
import { listQuotes } from '@/lib/db/queries/quote-list';
import { QuoteListQuerySchema } from '@/lib/schemas/quote-list';

export const metadata: Metadata = { title: 'Quotes' };

/** The page's own address for a state, search and page; empty values are left out of the link. */
function hrefOf(v: { status?: QuoteStatus; q?: string; page?: number }): string {
  const p = new URLSearchParams();
  if (v.status) p.set('status', v.status);
  if (v.q) p.set('q', v.q);
  if (v.page && v.page > 1) p.set('page', String(v.page));
  return `?${p}`;
}

export default async function QuotesPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  await requireAccessForPage('quotes.read');
  const raw = await searchParams;
  const parsed = QuoteListQuerySchema.safeParse({ status: raw.status, q: raw.q, page: raw.page });
  // A hand-edited address with a bad value shows the first page of everything rather than an error page.
  const query = parsed.success ? parsed.data : QuoteListQuerySchema.parse({});
  const { status, q, page, pageSize } = query;
  const { items: quotes, total } = await listQuotes(query);
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Quotes" lead="Newest change first. Make a new one from the cam shortlist." actions={null} />
      <nav aria-label="Filter by status" className="flex flex-wrap gap-2 text-sm">
        {[undefined, ...QUOTE_STATUSES].map((s) => (
          <Link
            key={s ?? 'all'}
            href={hrefOf({ status: s, q })}
            aria-current={status === s ? 'page' : undefined}
            className={`rounded px-2 py-1 ring-1 ring-steel-300 ${status === s ? 'bg-ink text-paper' : 'bg-paper-raised'}`}
          >
            {s ? quoteStatusWord(s) : 'All'}
          </Link>
        ))}
      </nav>
      <form role="search" method="get" className="flex flex-wrap items-end gap-2 text-sm">
        {status ? <input type="hidden" name="status" value={status} /> : null}
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Find a quote</span>
          <input
            type="search"
            name="q"
            defaultValue={q ?? ''}
            maxLength={100}
            placeholder="Number, customer or vehicle"
            className="w-72 rounded px-2 py-1 ring-1 ring-steel-300"
          />
        </label>
        <Button type="submit" variant="quiet">
          Search
        </Button>
        {q ? (
          <Link className="text-gauge-700 underline" href={hrefOf({ status })}>
            Clear the search
          </Link>
        ) : null}
      </form>
      <div className="overflow-x-auto rounded border border-steel-300 bg-paper-raised">
        <table className={tableClass}>
          <thead>
            <tr>
              <th className={thClass}>Number</th>
              <th className={thClass}>Customer</th>
              <th className={thClass}>Vehicle</th>
              <th className={thClass}>State</th>
              <th className={`${thClass} text-right`}>Total</th>
              <th className={`${thClass} text-right`}>Deposit</th>
              <th className={thClass}>Payment</th>
              <th className={thClass}>Changed</th>
            </tr>
          </thead>
          <tbody>
            {quotes.map((q) => (
              <tr key={q.id}>
                <td className={`${tdClass} spec`}>
                  <Link className="text-gauge-700 underline" href={`/quotes/${q.id}`}>
                    {q.number}
                  </Link>
                </td>
                <td className={tdClass}>{q.customerName}</td>
                <td className={tdClass}>{q.vehicleLabel ?? '—'}</td>
                <td className={tdClass}>
                  <QuoteStatusTag status={q.status} />
                  {q.discountApproval === 'pending' ? (
                    <span className="mt-0.5 block text-xs font-semibold">Discount waits for a manager</span>
                  ) : null}
                </td>
                <td className={`${tdClass} spec text-right`}>{formatMoney(q.totalCents)}</td>
                <td className={`${tdClass} spec text-right`}>{formatMoney(q.depositCents)}</td>
                <td className={tdClass}>
                  <PaymentStatusTag status={q.paymentStatus} />
                </td>
                <td className={`${tdClass} spec text-xs`}>{q.updatedAt.slice(0, 16).replace('T', ' ')}</td>
              </tr>
            ))}
            {quotes.length === 0 ? (
              <tr>
                <td colSpan={8} className={`${tdClass} text-ink-muted`}>
                  No quotes{status ? ` in the state “${quoteStatusWord(status)}”` : ''}
                  {q ? ` matching “${q}”` : ''}
                  {page > 1 ? ' on this page' : ' yet'}.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="flex flex-wrap items-center gap-3 text-sm">
        <span className="tabular-nums">
          {first}–{first === 0 ? 0 : first + quotes.length - 1} of {total} {total === 1 ? 'quote' : 'quotes'} · page{' '}
          {page} of {pages}
        </span>
        {page > 1 ? (
          <ButtonLink variant="quiet" href={hrefOf({ status, q, page: page - 1 })}>
            ← Newer
          </ButtonLink>
        ) : null}
        {page < pages ? (
          <ButtonLink variant="quiet" href={hrefOf({ status, q, page: page + 1 })}>
            Older →
          </ButtonLink>
        ) : null}
      </nav>
    </div>
  );
}
