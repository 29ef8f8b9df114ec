import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { formatMoney, longDate, percentFromBp } from '@/lib/format';
import { getPublicQuote } from '@/lib/quotes/public-quote';
import { isPastValidUntil } from '@/lib/quotes/deposit-rules';
import { CUSTOMER_CAUTIONS as CAUTIONS, REFUND_NOTE } from '@/lib/quotes/cautions';
import { isTaxable } from '@/lib/quotes/pricing';
import { refundStory } from '@/lib/quotes/refund-story';
import { CustomerPayments } from '@/components/quotes/customer-payments';
import { QuoteBasis } from '@/components/quotes/quote-basis';
import { ReplacedNotice } from '@/components/quotes/replaced-notice';
import './print.css';
import { CustomerCautions } from '@/components/ui/customer-cautions';

export const dynamic = 'force-dynamic';
// A private link: never indexed, never cached, never sent on as a referrer.
export const metadata: Metadata = {
  title: 'Your quote',
  robots: { index: false, follow: false },
  referrer: 'no-referrer',
};

const STATUS_WORDS: Record<string, { title: string; text: string }> = {
  sent: {
    title: 'Waiting for you',
    text: 'Read it through. When you are happy, accept it and pay the deposit to book the job.',
  },
  accepted: { title: 'Accepted, deposit not paid yet', text: 'You can pay the deposit below whenever you are ready.' },
  'deposit-paid': {
    title: 'Deposit paid — thank you',
    text: 'Your job is booked. We will be in touch about the date.',
  },
  declined: { title: 'Declined', text: 'This quote was declined. Call the shop if you would like a new one.' },
  expired: { title: 'Expired', text: 'This quote has run out. Call the shop for an up-to-date price.' },
  cancelled: { title: 'Cancelled', text: 'This quote was cancelled. Call the shop if that is a surprise.' },
  closed: {
    title: 'Paid in full — thank you',
    text: 'The job is done and the balance is paid. Keep this page or its PDF as your record.',
  },
  replaced: {
    title: 'Replaced by a newer quote',
    text: 'This quote was revised; the newer one is the one that counts.',
  },
};

export default async function CustomerQuotePage({
  params,
  searchParams,
}: {
  params: Promise<{ token: string }>;
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  const { token } = await params;
  const found = await getPublicQuote(token);
  if (!found) notFound();
  const { quote, shop } = found;
  const query = await searchParams;
  const open = quote.status === 'sent' || quote.status === 'accepted';
  // Past its valid-until day an open quote can no longer be accepted or paid (the checkout refuses it too).
  const lapsed = open && isPastValidUntil(quote.validUntil);
  const canPay = open && !lapsed && quote.depositCents > 0;
  // A refund is told as it is: a paid quote refunded in full is no longer "booked".
  // Amounts in the shop's own currency (shop settings), the one the deposit is charged in.
  const money = (cents: number) => formatMoney(cents, { currency: shop.currency });
  const refunded = refundStory(quote, money, shop.name);
  const state =
    refunded ??
    (quote.status === 'deposit-paid' && quote.balanceRequestedAt && quote.balanceDueCents > 0
      ? {
          title: 'Job done — balance to pay',
          text: `The work is done. ${money(quote.balanceDueCents)} is left to pay: below, or when you collect the car.`,
        }
      : lapsed
        ? {
            title: 'No longer valid',
            text: `This quote was valid until ${longDate(quote.validUntil!)}, so it can no longer be accepted or paid. Prices and parts change: call or write to ${shop.name} and we will send you a fresh quote.`,
          }
        : (STATUS_WORDS[quote.status] ?? { title: quote.status, text: '' }));
  return (
    <div className="customer-quote mx-auto max-w-2xl px-4 py-8 text-lg leading-relaxed text-ink print:max-w-none print:px-0 print:py-0 print:text-base">
      <p className="text-base text-ink-muted">{shop.name}</p>
      <h1 className="mt-1 text-3xl font-bold leading-tight sm:text-4xl">Your quote {quote.number}</h1>
      <p className="mt-2">
        For {quote.customer.name}
        {quote.build ? `, ${quote.build.vehicleLabel}` : ''}
      </p>
      {quote.validUntil && open && !lapsed ? (
        <p className="mt-1 text-base text-ink-muted">Valid until {longDate(quote.validUntil)}</p>
      ) : null}

      <p className="mt-3 flex flex-wrap gap-4 text-base print:hidden">
        <a className="font-semibold text-gauge-700 underline" href={`/api/q/${encodeURIComponent(token)}/pdf`}>
          Download as PDF
        </a>
        <span className="text-ink-muted">or use your browser’s Print to print this page.</span>
      </p>
      {quote.status === 'replaced' ? (
        <ReplacedNotice replacedBy={quote.replacedBy} shop={shop} customerEmail={quote.customer.email} />
      ) : null}

      {query.paid === 'balance' && quote.status !== 'closed' ? (
        <div role="status" className="mt-6 rounded-lg border border-gauge-500/40 bg-gauge-100 p-4">
          <p className="font-semibold">Payment received by the payment service — confirming</p>
          <p className="text-base">
            It can take a minute to reach us. Refresh this page shortly; you will not be charged twice.
          </p>
        </div>
      ) : null}
      {query.paid === '1' && quote.status !== 'deposit-paid' && quote.status !== 'closed' ? (
        <div role="status" className="mt-6 rounded-lg border border-gauge-500/40 bg-gauge-100 p-4">
          <p className="font-semibold">Payment received by the payment service — confirming</p>
          <p className="text-base">
            It can take a minute to reach us. Refresh this page shortly; you will not be charged twice.
          </p>
        </div>
      ) : null}
      {query.cancelled && canPay ? (
        <div role="status" className="mt-6 rounded-lg border border-steel-300 bg-paper-sunk p-4">
          <p className="font-semibold">Payment not made</p>
          <p className="text-base">Nothing was charged. You can pay the deposit below whenever you are ready.</p>
        </div>
      ) : null}

      <section
        aria-labelledby="state"
        className={`mt-6 rounded-lg border p-4 ${quote.status === 'deposit-paid' || quote.status === 'closed' ? 'border-ok-700/40 bg-ok-100' : 'border-steel-300 bg-paper-raised'}`}
      >
        <h2 id="state" className="text-xl font-semibold">
          Status: {state.title}
        </h2>
        <p className="text-base">{state.text}</p>
      </section>

      <section aria-labelledby="lines" className="mt-8">
        <h2 id="lines" className="text-2xl font-semibold">
          What is included
        </h2>
        <ul className="mt-3 divide-y divide-steel-300 rounded-lg border border-steel-300 bg-paper-raised">
          {quote.lines.map((line) => (
            <li key={line.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 px-4 py-3">
              <span className="min-w-0 flex-1">
                {line.description}
                <span className="block text-base text-ink-muted">
                  {line.kind === 'labor' ? `${line.quantity} hours of labour` : `Quantity ${line.quantity}`}
                  {isTaxable(line.kind) ? '' : ' · no sales tax'}
                </span>
              </span>
              <span className="tabular-nums font-semibold">{money(line.totalCents)}</span>
            </li>
          ))}
        </ul>
        <dl className="mt-4 grid grid-cols-[1fr_auto] gap-x-4 gap-y-1 tabular-nums">
          <dt>Before tax</dt>
          <dd className="text-right">{money(quote.subtotalCents)}</dd>
          <dt>Sales tax ({percentFromBp(quote.taxRateBp)} on parts)</dt>
          <dd className="text-right">{money(quote.taxCents)}</dd>
          <dt className="text-xl font-bold">Total</dt>
          <dd className="text-right text-xl font-bold">{money(quote.totalCents)}</dd>
        </dl>
      </section>

      <section aria-labelledby="deposit" className="mt-8 rounded-lg border-2 border-ember-500 bg-paper-raised p-5">
        <h2 id="deposit" className="text-2xl font-semibold">
          Deposit to book the job: <span className="tabular-nums">{money(quote.depositCents)}</span>
        </h2>
        <p className="mt-1 text-base">
          The rest, {money(Math.max(0, quote.totalCents - quote.depositCents))}, is paid when the job is done.
        </p>
        <h3 className="mt-4 text-xl font-semibold">Our deposit policy</h3>
        <p className="mt-1 whitespace-pre-line">{shop.depositPolicyText}</p>
        <p className="mt-2 text-base">{REFUND_NOTE}</p>
        {canPay ? (
          <form method="post" action={`/api/q/${encodeURIComponent(token)}/checkout`} className="mt-6 print:hidden">
            <button
              type="submit"
              className="min-h-14 w-full rounded-lg bg-ember-500 px-6 py-4 text-xl font-semibold text-paper-raised hover:bg-ember-600 focus-visible:outline focus-visible:outline-4 focus-visible:outline-gauge-500"
            >
              Accept and pay the deposit
            </button>
            <p className="mt-2 text-base text-ink-muted">
              By paying you accept this quote and the deposit policy above. You pay on the payment service’s secure
              page.
            </p>
          </form>
        ) : null}
      </section>

      {quote.payments.length ? <CustomerPayments quote={quote} token={token} currency={shop.currency} /> : null}

      {quote.snapshot ? <QuoteBasis snapshot={quote.snapshot} /> : null}

      <CustomerCautions cautions={CAUTIONS} />

      <p className="mt-8 text-base">
        Questions? Call {shop.name} on{' '}
        <a className="font-semibold text-gauge-700 underline" href={`tel:${shop.phone}`}>
          {shop.phone}
        </a>
        {shop.email ? (
          <>
            {' '}
            or write to{' '}
            <a className="font-semibold text-gauge-700 underline" href={`mailto:${shop.email}`}>
              {shop.email}
            </a>
          </>
        ) : null}
        .
      </p>
    </div>
  );
}
