'use client';

import { useState } from 'react';
import { centsToText, formatMoney } from '@/lib/format';
import { amountWithin } from '@/lib/forms/amount';
import { Button } from '@/components/ui/button';
import { RadioGroup } from '@/components/ui/field';
import type { QuotePanelProps } from './quote-run';

// The balance once the deposit is paid: what the job came to, what was paid and refunded, what is left,
// and the two ways to take the rest — e-mail the customer a pay-online link, or record money taken at
// the counter. The server checks the amount against the balance again and refuses a stale version.
export function BalancePanel({ quote, url, run, busy, canWrite }: QuotePanelProps) {
  const due = quote.balanceDueCents;
  const [amount, setAmount] = useState(centsToText(due));
  const [method, setMethod] = useState<'cash' | 'card-present'>('card-present');
  const [problem, setProblem] = useState<string | null>(null);
  const open = quote.status === 'deposit-paid' && due > 0;

  return (
    <section aria-labelledby="balance" className="rounded border border-steel-300 bg-paper-raised p-3 text-sm">
      <h2 id="balance" className="font-semibold">
        Balance
      </h2>
      <dl className="spec mt-2 grid max-w-md grid-cols-[1fr_auto] gap-x-4 gap-y-0.5">
        <dt className="font-sans">Job total</dt>
        <dd className="text-right">{formatMoney(quote.totalCents)}</dd>
        <dt className="font-sans">Deposit paid</dt>
        <dd className="text-right">{formatMoney(quote.depositPaidCents)}</dd>
        <dt className="font-sans">Balance payments</dt>
        <dd className="text-right">{formatMoney(quote.balancePaidCents)}</dd>
        <dt className="font-sans">Refunded</dt>
        <dd className="text-right">{formatMoney(quote.refundedCents)}</dd>
        <dt className="font-sans font-semibold">Balance due</dt>
        <dd className="text-right font-semibold" data-testid="balance-due">
          {formatMoney(due)}
        </dd>
      </dl>
      {quote.status === 'closed' ? (
        <p className="mt-2 font-semibold text-ok-700">
          Paid in full{quote.closedAt ? ` · closed ${quote.closedAt.slice(0, 10)}` : ''}.
        </p>
      ) : null}
      {open && quote.balanceRequestedAt ? (
        <p className="mt-2 text-ink-soft">
          Pay-the-balance link last e-mailed {quote.balanceRequestedAt.slice(0, 16).replace('T', ' ')} UTC.
        </p>
      ) : null}
      {open && canWrite ? (
        <div className="mt-3 flex flex-col gap-3">
          <div>
            <Button
              type="button"
              variant="primary"
              disabled={busy || !quote.customer.email}
              onClick={() =>
                void run(
                  'Not e-mailed',
                  'POST',
                  `${url}/balance-request`,
                  { version: quote.version },
                  `E-mailed ${quote.customer.email} the balance of ${formatMoney(due)} with a link to pay it online.`,
                )
              }
            >
              E-mail the pay-the-balance link
            </Button>
            {!quote.customer.email ? (
              <p className="mt-1 text-ink-soft">The customer has no e-mail address: take the balance at the counter.</p>
            ) : null}
          </div>
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              const checked = amountWithin(amount, due, 'pay');
              if ('problem' in checked) return setProblem(checked.problem);
              const { cents } = checked;
              setProblem(null);
              void run(
                'Not recorded',
                'POST',
                `${url}/payments`,
                { version: quote.version, amountCents: cents, method },
                `Recorded ${formatMoney(cents)} taken at the counter; the receipt is e-mailed to the customer.`,
              );
            }}
          >
            <RadioGroup
              name="method"
              legend="How the customer paid"
              legendHidden
              row
              options={
                [
                  ['card-present', 'Card at the counter'],
                  ['cash', 'Cash'],
                ] as const
              }
              value={method}
              onChange={setMethod}
            />
            <label>
              Amount taken ($)
              <input
                value={amount}
                onChange={(e) => setAmount(e.target.value)}
                inputMode="decimal"
                className="spec mt-1 block w-32 rounded border border-steel-300 px-1 py-0.5"
              />
            </label>
            <Button type="submit" variant="quiet" disabled={busy}>
              Record counter payment
            </Button>
            {problem ? (
              <p className="w-full text-fault-700" role="alert">
                {problem}
              </p>
            ) : null}
          </form>
        </div>
      ) : null}
    </section>
  );
}
