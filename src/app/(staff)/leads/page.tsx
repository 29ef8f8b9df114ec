import type { Metadata } from 'next';
import Link from 'next/link';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { StateTag } from '@/components/ui/state-tag';
import { LeadStatusTag, LEAD_STATUS_WORDS } from '@/components/leads/lead-status';
import { LeadNotes } from '@/components/leads/lead-notes';
import { LeadStatusForm } from '@/components/leads/lead-status-form';
import { ShortlistCards } from '@/components/leads/shortlist-view';
import { requireAccessForPage } from '@/lib/auth/guard';
import { leadListPage } from '@/lib/leads/lead-list';
import { answersInWords } from '@/lib/leads/questions';
import { LEAD_STATUSES, type LeadStatus } from '@/lib/schemas/lead';

export const metadata: Metadata = { title: 'Leads' };

const PAGE_SIZE = 20;

export default async function LeadsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  await requireAccessForPage('leads.follow-up');
  const raw = await searchParams;
  const status = (LEAD_STATUSES as readonly string[]).includes(raw.status ?? '')
    ? (raw.status as LeadStatus)
    : undefined;
  const page = Math.max(1, Math.trunc(Number(raw.page)) || 1);
  const {
    items,
    total,
    notes,
    staleTotal,
    staleAfterDays: limitDays,
  } = await leadListPage({ status, page, pageSize: PAGE_SIZE });
  const waited = (lead: (typeof items)[number]) => lead.staleDays;
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));
  const href = (p: number) =>
    `?${new URLSearchParams({ ...(status ? { status } : {}), ...(p > 1 ? { page: String(p) } : {}) }).toString()}`;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Leads"
        lead="Customers who answered the questionnaire at home and asked to be contacted. Newest first."
      />
      <nav aria-label="Filter by status" className="flex flex-wrap gap-2 text-sm">
        {[undefined, ...LEAD_STATUSES].map((s) => (
          <Link
            key={s ?? 'all'}
            href={s ? `?status=${s}` : '?'}
            aria-current={status === s ? 'page' : undefined}
            className={`rounded px-2 py-1 ring-1 ring-steel-300 ${status === s ? 'bg-ink text-paper' : 'bg-paper-raised'}`}
          >
            {s ? LEAD_STATUS_WORDS[s] : 'All'}
          </Link>
        ))}
      </nav>
      {staleTotal > 0 ? (
        <Banner
          tone="caution"
          title={`${staleTotal} new lead${staleTotal === 1 ? ' has' : 's have'} waited ${limitDays} day${limitDays === 1 ? '' : 's'} or more without contact`}
        >
          Call or write to them, then add a note or move them on. They are marked “Waiting” below. The number of days is
          set under Settings.
        </Banner>
      ) : null}
      {items.length === 0 ? (
        <p className="text-sm text-ink-muted">
          No leads{status ? ` with status “${LEAD_STATUS_WORDS[status]}”` : ''} yet.
        </p>
      ) : null}
      <ul className="flex flex-col gap-3">
        {items.map((lead) => (
          <li key={lead.id}>
            <article
              aria-labelledby={`lead-${lead.id}`}
              className="rounded border border-steel-300 bg-paper-raised p-4 text-sm"
            >
              <header className="flex flex-wrap items-baseline justify-between gap-2">
                <h2 id={`lead-${lead.id}`} className="text-base font-semibold">
                  {lead.name}{' '}
                  <span className="spec text-xs text-ink-muted">
                    #{lead.id} · {lead.createdAt.slice(0, 16).replace('T', ' ')}
                  </span>
                </h2>
                <span className="flex flex-wrap gap-2">
                  {waited(lead) !== null ? (
                    <StateTag tone="fault">
                      Waiting {waited(lead)} day{waited(lead) === 1 ? '' : 's'} without contact
                    </StateTag>
                  ) : null}
                  <LeadStatusTag status={lead.status} />
                </span>
              </header>
              <p className="mt-1">
                {lead.email ? (
                  <a className="text-gauge-700 underline" href={`mailto:${lead.email}`}>
                    {lead.email}
                  </a>
                ) : null}
                {lead.email && lead.phone ? ' · ' : null}
                {lead.phone ? (
                  <a className="spec text-gauge-700 underline" href={`tel:${lead.phone}`}>
                    {lead.phone}
                  </a>
                ) : null}
              </p>
              <div className="mt-3 grid gap-4 lg:grid-cols-2">
                <section aria-label="Their answers">
                  <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-muted">Their answers</h3>
                  <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
                    {answersInWords(lead.answers).map((a) => (
                      <div key={a.question} className="contents">
                        <dt className="text-ink-soft">{a.question}</dt>
                        <dd className="font-semibold">{a.answer}</dd>
                      </div>
                    ))}
                  </dl>
                </section>
                <section aria-label="The shortlist they saw">
                  <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-muted">
                    The shortlist they saw (indicative)
                  </h3>
                  <div className="mt-1">
                    {lead.shortlist ? <ShortlistCards shortlist={lead.shortlist} compact /> : <p>None stored.</p>}
                  </div>
                </section>
              </div>
              <LeadNotes leadId={lead.id} notes={notes.get(lead.id) ?? []} />
              <footer className="mt-3 flex flex-wrap items-center justify-between gap-3">
                <LeadStatusForm id={lead.id} status={lead.status} version={lead.version} />
                <ButtonLink href={`/interviews/new?lead=${lead.id}`} variant="primary">
                  Start an interview
                </ButtonLink>
              </footer>
            </article>
          </li>
        ))}
      </ul>
      {pages > 1 ? (
        <nav aria-label="Pages" className="flex items-center gap-3 text-sm">
          {page > 1 ? (
            <Link className="text-gauge-700 underline" href={href(page - 1)}>
              ← Newer
            </Link>
          ) : null}
          <span>
            Page {page} of {pages}
          </span>
          {page < pages ? (
            <Link className="text-gauge-700 underline" href={href(page + 1)}>
              Older →
            </Link>
          ) : null}
        </nav>
      ) : null}
    </div>
  );
}
