'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { sendJson } from '@/lib/api-client';
import { Button, ButtonAnchor } from '@/components/ui/button';
import type { QuoteRecord } from '@/lib/quotes/types';
import { isPastValidUntil } from '@/lib/quotes/deposit-rules';
import { canRevise, isOpen, staffMoves, stateWord, type QuoteStatus } from '@/lib/quotes/lifecycle';
import type { QuotePanelProps } from './quote-run';

// Where the quote stands and what staff may do next: only the moves the lifecycle allows from here are
// offered (the server checks again and answers 409 otherwise). Revising opens the new draft.
const MOVE_LABEL: Partial<Record<QuoteStatus, string>> = {
  accepted: 'Customer accepted (in person or by phone)',
  declined: 'Mark declined',
  expired: 'Mark expired',
  cancelled: 'Cancel the quote',
  closed: 'Balance paid — close the job',
};
const NEEDS_CONFIRM: readonly QuoteStatus[] = ['declined', 'cancelled', 'expired', 'closed'];

export function LifecyclePanel({ quote, url, run, busy, canWrite }: QuotePanelProps) {
  const router = useRouter();
  const [confirming, setConfirming] = useState<QuoteStatus | null>(null);
  const [validUntil, setValidUntil] = useState(quote.validUntil ?? '');
  const [reviseError, setReviseError] = useState<string | null>(null);
  // Closing by hand is for a job with nothing left to pay; otherwise the balance panel takes the money.
  const moves = canWrite ? staffMoves(quote.status).filter((to) => to !== 'closed' || quote.balanceDueCents === 0) : [];
  const datable = canWrite && ['draft', 'sent', 'accepted'].includes(quote.status);

  async function revise() {
    setReviseError(null);
    const { status, body } = await sendJson('POST', `${url}/revise`, { version: quote.version });
    if (status === 201) router.push(`/quotes/${(body as QuoteRecord).id}`);
    else setReviseError((body as { message?: string }).message ?? `The server answered ${status}.`);
  }

  return (
    <section aria-labelledby="lifecycle" className="rounded border border-steel-300 bg-paper-raised p-3 text-sm">
      <h2 id="lifecycle" className="font-semibold">
        State: {stateWord(quote.status)}
      </h2>
      <p className="mt-1 text-ink-soft">
        {quote.revision > 1 && quote.revisionOf ? (
          <>
            Revision {quote.revision}, replaces{' '}
            <Link className="underline" href={`/quotes/${quote.revisionOf.id}`}>
              {quote.revisionOf.number}
            </Link>
            .{' '}
          </>
        ) : null}
        {quote.replacedBy ? (
          <>
            Replaced by{' '}
            <Link className="underline" href={`/quotes/${quote.replacedBy.id}`}>
              {quote.replacedBy.number}
            </Link>{' '}
            ({stateWord(quote.replacedBy.status).toLowerCase()}); the customer’s old link says so.{' '}
          </>
        ) : null}
        {quote.validUntil
          ? `Valid until ${quote.validUntil}. `
          : 'Valid-until is set when the quote is sent (30 days unless you choose). '}
        {quote.closedAt ? `Closed ${quote.closedAt.slice(0, 10)}.` : ''}
      </p>
      {isOpen(quote.status) && isPastValidUntil(quote.validUntil) ? (
        <p role="status" className="mt-1 font-semibold text-caution-700">
          Past its valid-until day: the customer can no longer accept or pay it. Move the date, revise it, or mark it
          expired.
        </p>
      ) : null}
      <div className="mt-2 flex flex-wrap gap-2">
        {moves.map((to) =>
          confirming === to ? null : (
            <Button
              key={to}
              type="button"
              variant={to === 'accepted' || to === 'closed' ? 'primary' : 'quiet'}
              disabled={busy}
              onClick={() =>
                NEEDS_CONFIRM.includes(to)
                  ? setConfirming(to)
                  : void run(
                      'Not changed',
                      'POST',
                      `${url}/transition`,
                      { to, version: quote.version },
                      `Now: ${stateWord(to).toLowerCase()}.`,
                    )
              }
            >
              {MOVE_LABEL[to] ?? stateWord(to)}
            </Button>
          ),
        )}
        {canWrite && canRevise(quote.status) ? (
          <Button type="button" variant="quiet" disabled={busy} onClick={() => void revise()}>
            Revise (new draft, new number)
          </Button>
        ) : null}
        <ButtonAnchor variant="quiet" href={`${url}/pdf`}>
          Download PDF
        </ButtonAnchor>
      </div>
      {confirming ? (
        <div
          role="alertdialog"
          aria-labelledby="move-confirm"
          className="mt-2 rounded border border-caution-700 bg-caution-100 p-2"
        >
          <p id="move-confirm">
            {MOVE_LABEL[confirming]}: the quote becomes “{stateWord(confirming).toLowerCase()}”. Sure?
          </p>
          <div className="mt-2 flex gap-2">
            <Button
              type="button"
              variant="danger"
              disabled={busy}
              onClick={() =>
                void run(
                  'Not changed',
                  'POST',
                  `${url}/transition`,
                  { to: confirming, version: quote.version },
                  `Now: ${stateWord(confirming).toLowerCase()}.`,
                ).then(() => setConfirming(null))
              }
            >
              Yes, {(MOVE_LABEL[confirming] ?? '').toLowerCase()}
            </Button>
            <Button type="button" variant="quiet" onClick={() => setConfirming(null)}>
              No, go back
            </Button>
          </div>
        </div>
      ) : null}
      {reviseError ? (
        <p role="alert" className="mt-2 text-fault-700">
          Not revised: {reviseError}
        </p>
      ) : null}
      {datable ? (
        <form
          className="mt-2 flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            void run(
              'Date not saved',
              'PATCH',
              url,
              { version: quote.version, validUntil: validUntil || null },
              'Valid-until saved.',
            );
          }}
        >
          <label>
            Valid until
            <input
              type="date"
              value={validUntil}
              onChange={(e) => setValidUntil(e.target.value)}
              className="spec mt-1 block rounded border border-steel-300 px-1 py-0.5"
            />
          </label>
          <Button type="submit" variant="quiet" disabled={busy}>
            Save date
          </Button>
        </form>
      ) : null}
    </section>
  );
}
