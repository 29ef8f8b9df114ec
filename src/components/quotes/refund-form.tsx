'use client';

import { useState } from 'react';
import { formatMoney } from '@/lib/format';
import { amountWithin } from '@/lib/forms/amount';
import { METHOD_WORDS, PURPOSE_WORDS } from '@/lib/quotes/balance';
import type { PaymentRecord } from '@/lib/quotes/types';
import { Button } from '@/components/ui/button';
import { RadioGroup, SelectControl } from '@/components/ui/field';
import type { QuoteRun } from './quote-run';

// A refund is money leaving the shop: the manager picks the payment (the deposit or a balance payment),
// types an amount, then confirms it on a second step that says what happens to the job. When it gives back
// the last money held, it asks whether the job is cancelled or the quote reopened; nothing is sent until
// "Confirm refund". The quote's version goes with it, so a second click refunds nothing (409).

const leftOn = (p: PaymentRecord) => p.amountCents - p.refundedCents;
const paymentLabel = (p: PaymentRecord) =>
  `${PURPOSE_WORDS[p.purpose]} — ${METHOD_WORDS[p.method].toLowerCase()}, ${formatMoney(leftOn(p))} left`;

export function RefundForm({
  payments,
  version,
  balanceDueCents,
  url,
  run,
  busy,
}: {
  /** The payments still holding money, oldest first. */
  payments: PaymentRecord[];
  version: number;
  balanceDueCents: number;
  url: string;
  run: QuoteRun;
  busy: boolean;
}) {
  const [paymentId, setPaymentId] = useState(payments[0].id);
  const [amount, setAmount] = useState('');
  const [reason, setReason] = useState('');
  const [review, setReview] = useState<number | null>(null);
  const [after, setAfter] = useState<'cancel' | 'reopen'>('cancel');
  const [problem, setProblem] = useState<string | null>(null);
  const payment = payments.find((p) => p.id === paymentId) ?? payments[0];
  const leftCents = leftOn(payment);
  const whole = review !== null && review >= leftCents;
  // The last money held on the quote: the job cannot stay booked, so the manager says what happens to it.
  const last = whole && payments.length === 1;
  const what = payment.purpose === 'balance' ? 'balance payment' : 'deposit';
  const atCounter = payment.method !== 'online';

  if (review !== null) {
    return (
      <div
        role="alertdialog"
        aria-labelledby="refund-confirm"
        className="mt-3 rounded border-2 border-fault-700 bg-fault-100 p-3 text-sm"
      >
        <p id="refund-confirm" className="font-semibold">
          {atCounter
            ? `Record ${formatMoney(review)} handed back at the counter from the ${what}`
            : `Refund ${formatMoney(review)} of the ${what} to the customer’s card`}
          {whole ? ` — all that is left of it` : ''}? This cannot be undone.
        </p>
        {last ? (
          <RadioGroup
            name="after"
            legend="Then the job…"
            className="mt-2"
            options={
              [
                ['cancel', 'Cancel the job (the quote is closed and leaves the jobs list)'],
                ['reopen', 'Reopen the quote (the customer may pay the deposit again)'],
              ] as const
            }
            value={after}
            onChange={setAfter}
          />
        ) : (
          <p className="mt-1">
            Other money stays paid and the job stays on; {formatMoney(balanceDueCents + review)} is then left to pay on
            it.
          </p>
        )}
        <p className="mt-1">The customer is e-mailed about the refund.</p>
        <div className="mt-3 flex flex-wrap gap-2">
          <Button
            type="button"
            variant="danger"
            disabled={busy}
            onClick={() =>
              void run(
                'Not refunded',
                'POST',
                `${url}/refund`,
                {
                  version,
                  paymentId: payment.id,
                  amountCents: review,
                  ...(reason ? { reason } : {}),
                  ...(last ? { afterFullRefund: after } : {}),
                },
                atCounter
                  ? `Refund of ${formatMoney(review)} recorded as handed back at the counter.`
                  : `Refund of ${formatMoney(review)} sent to the payment service.`,
              ).then((ok) => {
                if (ok) {
                  setAmount('');
                  setReason('');
                }
                setReview(null);
              })
            }
          >
            Confirm refund
          </Button>
          <Button type="button" variant="quiet" onClick={() => setReview(null)}>
            Go back
          </Button>
        </div>
      </div>
    );
  }
  return (
    <form
      className="mt-3 flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        const checked = amountWithin(amount, leftCents, 'refund');
        if ('problem' in checked) return setProblem(checked.problem);
        setProblem(null);
        setReview(checked.cents);
      }}
    >
      {payments.length > 1 ? (
        <SelectControl
          id="refund-payment"
          label="Payment to refund"
          className="w-full"
          options={payments.map((p) => [String(p.id), paymentLabel(p)] as const)}
          value={String(payment.id)}
          onChange={(e) => setPaymentId(Number(e.target.value))}
        />
      ) : null}
      <label className="text-sm">
        Refund amount ($, at most {formatMoney(leftCents)})
        <input
          value={amount}
          onChange={(e) => setAmount(e.target.value)}
          inputMode="decimal"
          className="spec mt-1 block w-32 rounded border border-steel-300 px-1 py-0.5"
        />
      </label>
      <label className="text-sm">
        Reason (optional)
        <input
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          maxLength={255}
          className="mt-1 block w-48 rounded border border-steel-300 px-1 py-0.5"
        />
      </label>
      <Button type="submit" variant="danger" disabled={busy}>
        Review refund…
      </Button>
      {problem ? (
        <p className="w-full text-sm text-fault-700" role="alert">
          {problem}
        </p>
      ) : null}
    </form>
  );
}
