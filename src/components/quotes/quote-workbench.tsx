'use client';

import Link from 'next/link';
import { useState } from 'react';
import useSWR from 'swr';
import { getJson, sendJson, useVersionedSave } from '@/lib/api-client';
import { centsFromText, centsToText, formatMoney, percentFromBp } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { ConflictBanner } from '@/components/ui/conflict-banner';
import { CostsToggle, useCostsShown } from '@/components/ui/costs-toggle';
import { PageHeader } from '@/components/ui/page-header';
import { tableClass, TableScroll, tdClass, thClass } from '@/components/ui/table';
import type { StaffRole } from '@/lib/auth/guard';
import { roleCan } from '@/lib/auth/policy';
import type { QuoteRecord } from '@/lib/quotes/types';
import { isTaxable, lineTotalCents, QUOTE_LINE_KIND_LIST, type QuoteLineKind } from '@/lib/quotes/pricing';
import { BalancePanel } from './balance-panel';
import { DiscountApprovalPanel } from './discount-approval-panel';
import { LifecyclePanel } from './lifecycle-panel';
import { QuoteBasis } from './quote-basis';
import type { QuoteRun } from './quote-run';
import { RefundForm } from './refund-form';
import { PaymentList } from './payment-list';
import { QuoteStatusTag } from './status';

// The discount is typed in dollars like the price; more than the shop's limit waits for a manager.
type EditLine = {
  kind: QuoteLineKind;
  description: string;
  quantity: string;
  price: string;
  discount: string;
  camId: number | null;
  partId: number | null;
  laborOperationId: number | null;
};
type Notice = { tone: 'ok' | 'fault' | 'caution'; title: string; detail?: string } | null;

const toEdit = (q: QuoteRecord): EditLine[] =>
  q.lines.map((l) => ({
    kind: l.kind,
    description: l.description,
    quantity: String(l.quantity),
    price: centsToText(l.unitPriceCents),
    discount: centsToText(l.discountCents ?? 0),
    camId: l.camId,
    partId: l.partId,
    laborOperationId: l.laborOperationId,
  }));

function errorText(body: { message?: string; errors?: { field: string; message: string }[] }) {
  return body.errors?.length ? body.errors.map((e) => `${e.field}: ${e.message}`).join('; ') : undefined;
}

export function QuoteWorkbench({
  initial,
  role,
  springWarnings = [],
}: {
  initial: QuoteRecord;
  role: StaffRole;
  /** Spring kits on the quote that do not cover the cam's lift, in words (src/lib/catalogue/spring-kits.ts). */
  springWarnings?: string[];
}) {
  const url = `/api/quotes/${initial.id}`;
  const { data, mutate } = useSWR<QuoteRecord>(url, getJson, { fallbackData: initial, revalidateOnMount: false });
  const quote = data ?? initial;
  const [editing, setEditing] = useState<EditLine[] | null>(null);
  const [busy, setBusy] = useState(false);
  const [notice, setNotice] = useState<Notice>(null);
  const canWrite = roleCan(role, 'quotes.write');
  const isDraft = quote.status === 'draft';
  // A counter discount above the shop's limit keeps the quote from the customer until a manager approves it.
  const awaitingApproval = quote.discountApproval.state === 'pending';
  // The lines are the quote's versioned edit: a newer save answers 409, shown beside the lines typed here.
  const lineSave = useVersionedSave<QuoteRecord>(quote);
  // Costs come only to those who may see them (the server leaves them out); even then they stay hidden until asked.
  const costsSent = quote.costCents !== undefined;
  const [costsShown, showCosts] = useCostsShown();
  const costs = costsSent && costsShown;

  async function run(
    label: string,
    call: () => Promise<{
      status: number;
      body: QuoteRecord & { message?: string; errors?: { field: string; message: string }[]; current?: unknown };
    }>,
    okTitle: string,
  ) {
    setBusy(true);
    setNotice(null);
    const { status, body } = await call();
    setBusy(false);
    if (status >= 200 && status < 300) {
      await mutate(body, { revalidate: false });
      setNotice({ tone: 'ok', title: okTitle });
      return true;
    }
    if (status === 409 && body.current) await mutate(body.current as QuoteRecord, { revalidate: false });
    setNotice({
      tone: 'fault',
      title: `${label}: ${body.message ?? `the server answered ${status}`}`,
      detail: errorText(body),
    });
    return false;
  }

  const runJson: QuoteRun = (label, method, to, body, okTitle) => run(label, () => sendJson(method, to, body), okTitle);

  async function saveLines() {
    if (!editing) return;
    const lines: Array<{
      kind: QuoteLineKind;
      description: string;
      quantity: number;
      unitPriceCents: number;
      discountCents: number;
      camId: number | null;
      partId: number | null;
      laborOperationId: number | null;
    }> = [];
    for (const [i, l] of editing.entries()) {
      const cents = centsFromText(l.price);
      const discountCents = l.discount.trim() === '' ? 0 : centsFromText(l.discount);
      const quantity = Number(l.quantity);
      if (cents === null)
        return setNotice({ tone: 'fault', title: `Line ${i + 1}: the price must be dollars and cents, e.g. 129.50` });
      if (discountCents === null)
        return setNotice({ tone: 'fault', title: `Line ${i + 1}: the discount must be dollars and cents, e.g. 50.00` });
      if (!Number.isFinite(quantity) || quantity <= 0)
        return setNotice({ tone: 'fault', title: `Line ${i + 1}: the quantity must be a number above 0` });
      lines.push({
        kind: l.kind,
        description: l.description,
        quantity,
        unitPriceCents: cents,
        discountCents,
        camId: l.camId,
        partId: l.partId,
        laborOperationId: l.laborOperationId,
      });
    }
    if (await run('Not saved', () => lineSave.save('PATCH', url, { lines }), 'Lines saved; totals updated.'))
      setEditing(null);
  }

  const set = (i: number, change: Partial<EditLine>) =>
    setEditing((rows) => rows!.map((r, j) => (j === i ? { ...r, ...change } : r)));
  // Any payment still holding money can be refunded: the deposit or a balance payment (online or at the counter).
  const refundable = quote.payments.filter(
    (p) => !p.duplicateOfPaymentId && (p.status === 'paid' || p.status === 'partially-refunded'),
  );

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={`Quote ${quote.number}`}
        back={{ href: '/quotes', label: 'Quotes' }}
        lead={
          <>
            {quote.customer.name}
            {quote.customer.email ? ` <${quote.customer.email}>` : ' (no e-mail on file)'} ·{' '}
            {quote.build?.vehicleLabel ?? 'no build'} · <QuoteStatusTag status={quote.status} />
          </>
        }
        actions={
          canWrite ? (
            <>
              {isDraft && !editing ? (
                <Button type="button" variant="quiet" onClick={() => setEditing(toEdit(quote))}>
                  Edit lines
                </Button>
              ) : null}
              {(isDraft || quote.status === 'sent') && !editing ? (
                <Button
                  type="button"
                  variant="primary"
                  disabled={busy || awaitingApproval}
                  aria-describedby={awaitingApproval ? 'discount-approval-note' : undefined}
                  onClick={() =>
                    run(
                      'Not sent',
                      () => sendJson('POST', `${url}/send`),
                      `Sent to ${quote.customer.email}. The customer’s link is in the e-mail.`,
                    )
                  }
                >
                  {quote.status === 'sent' ? 'Send again (new link)' : 'Send to customer'}
                </Button>
              ) : null}
            </>
          ) : null
        }
      />
      {notice ? (
        <Banner tone={notice.tone} title={notice.title}>
          {notice.detail}
        </Banner>
      ) : null}
      <DiscountApprovalPanel
        quote={quote}
        url={url}
        run={runJson}
        busy={busy}
        canApprove={roleCan(role, 'quotes.approve-discount')}
      />
      {springWarnings.length ? (
        <Banner tone="caution" title="Springs: check the kit before this quote goes out">
          <ul className="list-disc pl-5">
            {springWarnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Banner>
      ) : null}
      <LifecyclePanel key={quote.version} quote={quote} url={url} run={runJson} busy={busy} canWrite={canWrite} />
      {quote.status === 'deposit-paid' || quote.status === 'closed' ? (
        <BalancePanel
          key={`balance-${quote.version}`}
          quote={quote}
          url={url}
          run={runJson}
          busy={busy}
          canWrite={canWrite}
        />
      ) : null}
      {!isDraft ? (
        <p className="text-sm text-ink-soft">
          Lines can be changed only while the quote is a draft; revise a sent quote to change them.
        </p>
      ) : null}

      <TableScroll label="Quote lines">
        <table className={tableClass}>
          <caption className="sr-only">Quote lines</caption>
          <thead>
            <tr>
              <th className={thClass}>Kind</th>
              <th className={thClass}>Description</th>
              <th className={`${thClass} text-right`}>Qty / h</th>
              <th className={`${thClass} text-right`}>Unit</th>
              {editing ? <th className={`${thClass} text-right`}>Discount</th> : null}
              <th className={`${thClass} text-right`}>Line</th>
              <th className={thClass}>Tax</th>
              {costs ? <th className={`${thClass} text-right`}>Unit cost</th> : null}
              {editing ? (
                <th className={thClass}>
                  <span className="sr-only">Remove</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {editing
              ? editing.map((l, i) => {
                  const cents = centsFromText(l.price);
                  const off = l.discount.trim() === '' ? 0 : centsFromText(l.discount);
                  const q = Number(l.quantity);
                  const total =
                    cents !== null &&
                    off !== null &&
                    Number.isFinite(q) &&
                    q >= 0 &&
                    Math.abs(Math.round(q * 100) - q * 100) < 1e-6
                      ? Math.max(0, lineTotalCents(q, cents) - off)
                      : null;
                  // A catalogue line's kind (and so its tax) follows the catalogue item.
                  const fromCatalogue = Boolean(l.camId || l.partId || l.laborOperationId);
                  return (
                    <tr key={i}>
                      <td className={tdClass}>
                        <select
                          aria-label={`Line ${i + 1} kind`}
                          value={l.kind}
                          disabled={fromCatalogue}
                          title={fromCatalogue ? 'Follows the catalogue item' : undefined}
                          onChange={(e) => set(i, { kind: e.target.value as QuoteLineKind })}
                          className="rounded border border-steel-300 bg-paper-raised px-1 py-0.5"
                        >
                          {QUOTE_LINE_KIND_LIST.map((k) => (
                            <option key={k}>{k}</option>
                          ))}
                        </select>
                      </td>
                      <td className={tdClass}>
                        <input
                          aria-label={`Line ${i + 1} description`}
                          value={l.description}
                          onChange={(e) => set(i, { description: e.target.value })}
                          className="w-full rounded border border-steel-300 px-1 py-0.5"
                        />
                      </td>
                      <td className={tdClass}>
                        <input
                          aria-label={`Line ${i + 1} quantity`}
                          inputMode="decimal"
                          value={l.quantity}
                          onChange={(e) => set(i, { quantity: e.target.value })}
                          className="spec w-20 rounded border border-steel-300 px-1 py-0.5 text-right"
                        />
                      </td>
                      <td className={tdClass}>
                        <input
                          aria-label={`Line ${i + 1} unit price in dollars`}
                          inputMode="decimal"
                          value={l.price}
                          onChange={(e) => set(i, { price: e.target.value })}
                          className="spec w-24 rounded border border-steel-300 px-1 py-0.5 text-right"
                        />
                      </td>
                      <td className={tdClass}>
                        <input
                          aria-label={`Line ${i + 1} discount in dollars`}
                          inputMode="decimal"
                          value={l.discount}
                          onChange={(e) => set(i, { discount: e.target.value })}
                          className="spec w-24 rounded border border-steel-300 px-1 py-0.5 text-right"
                        />
                      </td>
                      <td className={`${tdClass} spec text-right`}>{total === null ? 'check' : formatMoney(total)}</td>
                      <td className={tdClass}>{isTaxable(l.kind) ? 'taxed' : 'no tax'}</td>
                      {costs ? <td className={tdClass} /> : null}
                      <td className={tdClass}>
                        <button
                          type="button"
                          className="text-fault-700 underline"
                          onClick={() => setEditing((rows) => rows!.filter((_, j) => j !== i))}
                        >
                          Remove
                        </button>
                      </td>
                    </tr>
                  );
                })
              : quote.lines.map((l) => (
                  <tr key={l.id}>
                    <td className={tdClass}>{l.kind}</td>
                    <td className={tdClass}>{l.description}</td>
                    <td className={`${tdClass} spec text-right`}>
                      {l.quantity}
                      {l.kind === 'labor' ? ' h' : ''}
                    </td>
                    <td className={`${tdClass} spec text-right`}>{formatMoney(l.unitPriceCents)}</td>
                    <td className={`${tdClass} spec text-right`}>
                      {formatMoney(l.totalCents)}
                      {l.discountCents ? (
                        <span className="block text-xs text-ink-muted">after {formatMoney(l.discountCents)} off</span>
                      ) : null}
                    </td>
                    <td className={tdClass}>{isTaxable(l.kind) ? 'taxed' : 'no tax'}</td>
                    {costs ? (
                      <td className={`${tdClass} spec text-right`}>{formatMoney(l.unitCostCents ?? null)}</td>
                    ) : null}
                  </tr>
                ))}
          </tbody>
        </table>
      </TableScroll>
      {editing && lineSave.conflict ? (
        <ConflictBanner
          title="Someone else saved this quote while you were editing its lines. Nothing was overwritten."
          onTheirs={() => {
            const theirs = lineSave.settle();
            if (theirs) setEditing(theirs.status === 'draft' ? toEdit(theirs) : null);
          }}
          onMine={() => lineSave.settle()}
          theirsLabel="Load their lines"
          mineLabel="Keep my lines (then save again)"
        >
          Theirs: {lineSave.conflict.lines.length} line(s), total {formatMoney(lineSave.conflict.totalCents)},{' '}
          <QuoteStatusTag status={lineSave.conflict.status} />. The table above shows yours until you choose.
        </ConflictBanner>
      ) : null}
      {editing ? (
        <div className="flex flex-wrap gap-2">
          <Button
            type="button"
            variant="quiet"
            onClick={() =>
              setEditing((rows) => [
                ...rows!,
                {
                  kind: 'other',
                  description: '',
                  quantity: '1',
                  price: '0.00',
                  discount: '0.00',
                  camId: null,
                  partId: null,
                  laborOperationId: null,
                },
              ])
            }
          >
            Add a line
          </Button>
          <Button type="button" variant="primary" disabled={busy || Boolean(lineSave.conflict)} onClick={saveLines}>
            Save lines
          </Button>
          <Button type="button" variant="quiet" onClick={() => setEditing(null)}>
            Cancel
          </Button>
        </div>
      ) : null}

      <div className="grid gap-4 md:grid-cols-2">
        <section aria-labelledby="totals" className="rounded border border-steel-300 bg-paper-raised p-3">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id="totals" className="text-sm font-semibold">
              Totals
            </h2>
            {costsSent ? <CostsToggle shown={costsShown} onChange={showCosts} /> : null}
          </div>
          <dl className="spec mt-2 grid grid-cols-[1fr_auto] gap-x-4 gap-y-0.5 text-sm">
            <dt className="font-sans">Subtotal</dt>
            <dd className="text-right">{formatMoney(quote.subtotalCents)}</dd>
            <dt className="font-sans">Tax ({percentFromBp(quote.taxRateBp)} on goods)</dt>
            <dd className="text-right">{formatMoney(quote.taxCents)}</dd>
            <dt className="font-sans font-semibold">Total</dt>
            <dd className="text-right font-semibold">{formatMoney(quote.totalCents)}</dd>
            <dt className="font-sans">Deposit</dt>
            <dd className="text-right">{formatMoney(quote.depositCents)}</dd>
            {costs ? (
              <>
                <dt className="font-sans">Goods cost</dt>
                <dd className="text-right">{formatMoney(quote.costCents)}</dd>
                <dt className="font-sans">Goods margin</dt>
                <dd className="text-right">{formatMoney(quote.marginCents)}</dd>
              </>
            ) : null}
          </dl>
        </section>
        <section aria-labelledby="payment" className="rounded border border-steel-300 bg-paper-raised p-3">
          <h2 id="payment" className="text-sm font-semibold">
            Payments
          </h2>
          <p className="mt-1 text-sm">
            Paid {formatMoney(quote.paidCents)} · refunded {formatMoney(quote.refundedCents)} · sent{' '}
            {quote.sentAt ? quote.sentAt.slice(0, 16).replace('T', ' ') : 'not yet'}
          </p>
          <PaymentList payments={quote.payments} receiptHref={(id) => `${url}/payments/${id}/receipt`} />
          {quote.status === 'closed' && quote.balanceDueCents === 0 ? (
            <p className="mt-2 text-sm">
              <a className="underline" href={`${url}/invoice`}>
                Final invoice (PDF)
              </a>
            </p>
          ) : null}
          {roleCan(role, 'quotes.refund') && refundable.length ? (
            <RefundForm
              key={`refund-${quote.version}`}
              payments={refundable}
              version={quote.version}
              balanceDueCents={quote.balanceDueCents}
              url={url}
              run={runJson}
              busy={busy}
            />
          ) : null}
        </section>
      </div>
      {quote.snapshot ? <QuoteBasis snapshot={quote.snapshot} compact /> : null}
      <p className="text-xs text-ink-muted">
        Made from the{' '}
        <Link className="underline" href="/advisor">
          cam shortlist
        </Link>
        . Tax applies to the cam, parts and other goods; labour and the tune are not taxed.
      </p>
    </div>
  );
}
