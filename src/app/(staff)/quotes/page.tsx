import type { Metadata } from 'next';
import Link from 'next/link';
import { formatCents } from '@/components/catalogue/format';
import { PageHeader, tableClass, tdClass, thClass } from '@/components/catalogue/ui';
import { PaymentStatusTag, QuoteStatusTag, quoteStatusWord } from '@/components/quotes/status';
import { requireRoleForPage } from '@/lib/auth/guard';
import { QUOTE_STATUSES, type QuoteStatus } from '@/lib/db/models/quote';
import { listQuotes } from '@/lib/db/queries/quotes';

export const metadata: Metadata = { title: 'Quotes' };

export default async function QuotesPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  await requireRoleForPage('manager', 'counter', 'tech');
  const raw = await searchParams;
  const status = (QUOTE_STATUSES as readonly string[]).includes(raw.status ?? '') ? (raw.status as QuoteStatus) : undefined;
  const quotes = await listQuotes({ status });
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Quotes" lead="Newest change first. Make a new one from the cam shortlist." actions={null} />
      <nav aria-label="Filter by status" className="flex flex-wrap gap-2 text-sm">
        {[undefined, ...QUOTE_STATUSES].map((s) => (
          <Link key={s ?? 'all'} href={s ? `?status=${s}` : '?'} aria-current={status === s ? 'page' : undefined} className={`rounded px-2 py-1 ring-1 ring-steel-300 ${status === s ? 'bg-ink text-paper' : 'bg-paper-raised'}`}>
            {s ? quoteStatusWord(s) : 'All'}
          </Link>
        ))}
      </nav>
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
                <td className={`${tdClass} spec`}><Link className="text-gauge-700 underline" href={`/quotes/${q.id}`}>{q.number}</Link></td>
                <td className={tdClass}>{q.customerName}</td>
                <td className={tdClass}>{q.vehicleLabel ?? '—'}</td>
                <td className={tdClass}><QuoteStatusTag status={q.status} /></td>
                <td className={`${tdClass} spec text-right`}>{formatCents(q.totalCents)}</td>
                <td className={`${tdClass} spec text-right`}>{formatCents(q.depositCents)}</td>
                <td className={tdClass}><PaymentStatusTag status={q.paymentStatus} /></td>
                <td className={`${tdClass} spec text-xs`}>{q.updatedAt.slice(0, 16).replace('T', ' ')}</td>
              </tr>
            ))}
            {quotes.length === 0 ? (
              <tr><td colSpan={8} className={`${tdClass} text-ink-muted`}>No quotes{status ? ` in the state “${quoteStatusWord(status)}”` : ''} yet.</td></tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
