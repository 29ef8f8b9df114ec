import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CUSTOMER_CAUTIONS, ShortlistCards } from '@/components/leads/shortlist-view';
import { getLeadByToken } from '@/lib/db/queries/leads';
import { SHORTLIST_SIZE, shortlistForCustomer } from '@/lib/leads/shortlist';
import { CustomerCautions } from '@/components/ui/customer-cautions';

const SHOWN_WORDS: Record<number, string> = { 1: 'The one', 2: 'The two', 3: 'The three' };

export const dynamic = 'force-dynamic';
// A private link: never indexed, never sent on as a referrer.
export const metadata: Metadata = {
  title: 'Your indicative shortlist',
  robots: { index: false, follow: false },
  referrer: 'no-referrer',
};

export default async function AskResultPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const found = await getLeadByToken(token);
  if (!found || !found.lead.shortlist) notFound();
  const { lead, shop } = found;
  const shortlist = shortlistForCustomer(lead.shortlist!, lead.answers);
  return (
    <div className="mx-auto max-w-2xl px-4 py-8 text-lg leading-relaxed text-ink">
      <p className="text-base text-ink-muted">{shop?.name ?? 'The shop'}</p>
      <h1 className="mt-1 text-3xl font-bold leading-tight sm:text-4xl">Your indicative shortlist</h1>
      <section aria-labelledby="estimate" className="mt-6 rounded-lg border-2 border-gauge-500 bg-gauge-100 p-4">
        <h2 id="estimate" className="text-xl font-semibold">
          This is an estimate, not a quote
        </h2>
        <p className="text-base">
          We worked from your answers and typical figures for a stock{' '}
          {shortlist.engineLiters.toLocaleString('en-US', { minimumFractionDigits: 1 })} litre engine. The shop checks
          your actual engine before recommending anything; prices are starting points only.
        </p>
      </section>
      <section aria-labelledby="contact" className="mt-6 rounded-lg border border-ok-700/40 bg-ok-100 p-4">
        <h2 id="contact" className="text-xl font-semibold">
          The shop will contact you
        </h2>
        <p className="text-base">
          Thank you, {lead.name}. We have your answers and will be in touch
          {shop?.phone ? (
            <>
              {' '}
              — or call us on{' '}
              <a className="font-semibold text-gauge-700 underline" href={`tel:${shop.phone}`}>
                {shop.phone}
              </a>
            </>
          ) : null}
          . Keep this page’s address if you want to look at it again; it is private to you.
        </p>
      </section>

      <section aria-labelledby="cams" className="mt-8">
        <h2 id="cams" className="text-2xl font-semibold">
          {SHOWN_WORDS[shortlist.entries.length] ?? 'The ones'} that fit best
        </h2>
        {lead.answers.emissions === 'no' ? null : (
          <p className="mt-2 text-base">
            Your vehicle has to pass an emissions test
            {lead.answers.emissions === 'unsure' ? ' (you were not sure, so we assume it does)' : ''}, so only cams
            certified for emissions-tested road use are listed
            {shortlist.entries.length < SHORTLIST_SIZE ? '; the shop has no more of those that suit your answers' : ''}.
          </p>
        )}
        <div className="mt-3">
          <ShortlistCards shortlist={shortlist} />
        </div>
      </section>

      <CustomerCautions cautions={CUSTOMER_CAUTIONS} />

      <p className="mt-8 text-base">
        <Link href="/" className="inline-flex min-h-12 items-center font-semibold text-gauge-700 underline">
          Back to the start page
        </Link>
      </p>
    </div>
  );
}
