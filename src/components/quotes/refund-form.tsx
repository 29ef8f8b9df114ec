'use client';

import { useState } from 'react';
import { formatMoney } from '@/lib/format';
import { amountWithin } from '@/lib/forms/amount';
import { Button } from '@/components/ui/button';
import { RadioGroup } from '@/components/ui/field';
import type { QuoteRun } from './quote-run';

// A refund is money leaving the shop: the manager types an amount, then confirms it on a second step
// that says what happens to the job. A full refund asks whether the job is cancelled or the quote
// reopened for a new payment; nothing is sent until "Confirm refund".
export function RefundForm({
  leftCents,
  url,
  run,
  busy,
}: {
  leftCents: number;
  url: string;
  run: QuoteRun;
  busy: boolean;
}) {
  const [amount, setAmount] = useState('');
  const [reason, setReason] = useState('');
  const [review, setReview] = useState<number | null>(null);
  const [after, setAfter] = useState<'cancel' | 'reopen'>('cancel');
  const [problem, setProblem] = useState<string | null>(null);
  const full = review !== null && review >= leftCents;

  if (review !== null) {
    return (
      <div
        role="alertdialog"
        aria-labelledby="refund-confirm"
        className="mt-3 rounded border-2 border-fault-700 bg-fault-100 p-3 text-sm"
      >
        <p id="refund-confirm" className="font-semibold">
          Refund {formatMoney(review)} to the customer’s card{full ? ' — the whole deposit that is left' : ''}? This
          cannot be undone.
        </p>
        {full ? (
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
          <p className="mt-1">Part of the deposit stays paid; the job stays booked.</p>
        )}
        <p className="mt-1">The customer is e-mailed when the whole deposit has been refunded.</p>
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
                { amountCents: review, ...(reason ? { reason } : {}), ...(full ? { afterFullRefund: after } : {}) },
                `Refund of ${formatMoney(review)} sent to the payment service.`,
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
