import { formatMoney, longDate } from '@/lib/format';
import type { QuoteRecord } from '@/lib/quotes/types';
import { METHOD_WORDS, PURPOSE_WORDS } from '@/lib/quotes/balance';

// The customer's own account of a paid quote: each payment with its receipt, what was refunded, what is
// left, the button to pay the balance once the shop has asked for it, and the final invoice when paid.

export function CustomerPayments({ quote, token, currency }: { quote: QuoteRecord; token: string; currency: string }) {
  const base = `/api/q/${encodeURIComponent(token)}`;
  const canPayBalance =
    quote.status === 'deposit-paid' && quote.balanceDueCents > 0 && quote.balanceRequestedAt !== null;
  const paidInFull = quote.status === 'closed' && quote.balanceDueCents === 0;
  return (
    <section aria-labelledby="paid" className="mt-8 rounded-lg border border-steel-300 bg-paper-raised p-5">
      <h2 id="paid" className="text-2xl font-semibold">
        What you have paid
      </h2>
      <ul className="mt-3 flex flex-col gap-2">
        {quote.payments.map((p) => (
          <li key={p.id} className="flex flex-wrap items-baseline justify-between gap-x-4">
            <span>
              {PURPOSE_WORDS[p.purpose]}, {METHOD_WORDS[p.method].toLowerCase()}
              {p.paidAt ? `, ${longDate(p.paidAt)}` : ''}
              {p.refundedCents ? ` (${formatMoney(p.refundedCents, { currency: p.currency })} refunded)` : ''}
              <a
                className="ml-2 text-base font-semibold text-gauge-700 underline print:hidden"
                href={`${base}/receipts/${p.id}`}
              >
                Receipt (PDF)
              </a>
            </span>
            <span className="tabular-nums font-semibold">{formatMoney(p.amountCents, { currency: p.currency })}</span>
          </li>
        ))}
      </ul>
      <dl className="mt-4 grid grid-cols-[1fr_auto] gap-x-4 gap-y-1 tabular-nums">
        <dt>Paid so far{quote.refundedCents ? ', less refunds' : ''}</dt>
        <dd className="text-right">{formatMoney(quote.paidCents - quote.refundedCents, { currency })}</dd>
        <dt className="text-xl font-bold">Left to pay</dt>
        <dd className="text-right text-xl font-bold">{formatMoney(quote.balanceDueCents, { currency })}</dd>
      </dl>
      {paidInFull ? (
        <p className="mt-3">
          Paid in full — thank you.{' '}
          <a className="font-semibold text-gauge-700 underline" href={`${base}/invoice`}>
            Final invoice (PDF)
          </a>
        </p>
      ) : null}
      {canPayBalance ? (
        <form method="post" action={`${base}/balance-checkout`} className="mt-6 print:hidden">
          <button
            type="submit"
            className="min-h-14 w-full rounded-lg bg-ember-500 px-6 py-4 text-xl font-semibold text-paper-raised hover:bg-ember-600 focus-visible:outline focus-visible:outline-4 focus-visible:outline-gauge-500"
          >
            Pay the balance of {formatMoney(quote.balanceDueCents, { currency })}
          </button>
          <p className="mt-2 text-base text-ink-muted">
            You pay on the payment service’s secure page. You can also pay when you collect the car.
          </p>
        </form>
      ) : null}
    </section>
  );
}
