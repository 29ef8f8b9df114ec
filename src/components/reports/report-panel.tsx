'use client';

import useSWR from 'swr';
import { ApiError, getJson } from '@/lib/api-client';
import { count, formatMoney, percentFromBp } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { Button, ButtonAnchor } from '@/components/ui/button';
import { tableClass, TableScroll, tdClass, thClass } from '@/components/ui/table';
import { quoteStatusWord } from '@/components/quotes/status';
import type { ReportSummary } from '@/lib/reports/types';
import type { Margin } from '@/lib/reports/arithmetic';
import { StatusChart } from './status-chart';

// The manager's numbers: one calm table, every figure with its unit or currency beside it.
const pct = (bp: number | null) => percentFromBp(bp, 2);
const quotes = (n: number) => count(n, n === 1 ? 'quote' : 'quotes');

function Row({ label, figure, value, note }: { label: string; figure: string; value?: string; note?: string }) {
  return (
    <tr>
      <th scope="row" className={`${tdClass} text-left font-normal`}>
        {label}
      </th>
      <td className={`${tdClass} spec whitespace-nowrap text-right`}>{figure}</td>
      <td className={`${tdClass} spec whitespace-nowrap text-right`}>{value ?? ''}</td>
      <td className={`${tdClass} text-xs text-ink-muted`}>{note ?? ''}</td>
    </tr>
  );
}

function Section({ title }: { title: string }) {
  return (
    <tr>
      <th
        scope="rowgroup"
        colSpan={4}
        className="bg-paper-sunk px-2 py-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft"
      >
        {title}
      </th>
    </tr>
  );
}

function MarginRow({ label, m }: { label: string; m: Margin }) {
  return (
    <Row
      label={label}
      figure={pct(m.marginBp)}
      value={formatMoney(m.marginCents)}
      note={`sold ${formatMoney(m.revenueCents)}, cost ${formatMoney(m.costCents)}`}
    />
  );
}

export function ReportPanel({ from, to }: { from?: string; to?: string }) {
  const query = new URLSearchParams();
  if (from) query.set('from', from);
  if (to) query.set('to', to);
  const url = `/api/reports/summary${query.size ? `?${query}` : ''}`;
  const { data, error, isLoading } = useSWR<ReportSummary, ApiError>(url, getJson);
  const csvUrl = `/api/reports/quotes.csv${data ? `?from=${data.range.from}&to=${data.range.to}` : ''}`;

  return (
    <div className="flex flex-col gap-4">
      <form method="get" action="/reports" className="flex flex-wrap items-end gap-3 text-sm" aria-label="Date range">
        <label className="flex flex-col gap-1">
          <span className="text-ink-soft">From (first day)</span>
          <input
            type="date"
            name="from"
            defaultValue={data?.range.from ?? from ?? ''}
            className="spec rounded border border-steel-300 bg-paper-raised px-2 py-1"
          />
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-ink-soft">To (last day)</span>
          <input
            type="date"
            name="to"
            defaultValue={data?.range.to ?? to ?? ''}
            className="spec rounded border border-steel-300 bg-paper-raised px-2 py-1"
          />
        </label>
        <Button type="submit" variant="primary">
          Show
        </Button>
        <ButtonAnchor href="/reports" variant="quiet">
          Last 30 days
        </ButtonAnchor>
        {data && data.created.count > 0 ? (
          <ButtonAnchor href={csvUrl} variant="quiet" download>
            Download quotes (CSV)
          </ButtonAnchor>
        ) : null}
      </form>

      {error ? (
        <Banner
          tone="fault"
          title={error.status === 422 ? 'That date range cannot be used.' : 'The numbers did not load.'}
        >
          {error.body.errors?.length ? (
            <ul className="list-disc pl-5">
              {error.body.errors.map((e) => (
                <li key={e.field}>
                  <span className="spec">{e.field}</span>: {e.message}
                </li>
              ))}
            </ul>
          ) : (
            <p>{error.message}</p>
          )}
        </Banner>
      ) : null}
      {isLoading ? (
        <p className="text-sm text-ink-muted" role="status">
          Counting the quotes and deposits…
        </p>
      ) : null}

      {data ? (
        <>
          <p className="text-sm text-ink-soft">
            <span className="spec">{data.range.from}</span> to <span className="spec">{data.range.to}</span> (
            {count(data.range.days, data.range.days === 1 ? 'day' : 'days')}, UTC, both days included).
          </p>
          {data.created.count === 0 && data.deposits.count === 0 ? (
            <Banner tone="info" title="No quotes in this range yet">
              <p>Pick a wider range, or make a quote from the cam shortlist.</p>
            </Banner>
          ) : (
            <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
              <TableScroll label="Quotes, deposits and margin">
                <table className={tableClass}>
                  <caption className="sr-only">
                    Quotes and deposits from {data.range.from} to {data.range.to}
                  </caption>
                  <thead>
                    <tr>
                      <th scope="col" className={thClass}>
                        Figure
                      </th>
                      <th scope="col" className={`${thClass} text-right`}>
                        Count / rate
                      </th>
                      <th scope="col" className={`${thClass} text-right`}>
                        Amount
                      </th>
                      <th scope="col" className={thClass}>
                        What it counts
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    <Section title="Quotes created in the range" />
                    <Row
                      label="All quotes"
                      figure={quotes(data.created.count)}
                      value={formatMoney(data.created.valueCents)}
                      note="total incl. tax"
                    />
                    {data.byStatus.map((s) => (
                      <Row
                        key={s.status}
                        label={quoteStatusWord(s.status)}
                        figure={quotes(s.count)}
                        value={formatMoney(s.valueCents)}
                        note="state now"
                      />
                    ))}
                    <Row
                      label="Average quote"
                      figure=""
                      value={formatMoney(data.averageQuoteCents)}
                      note="total ÷ quotes"
                    />
                    <Row
                      label="Sent → deposit paid"
                      figure={pct(data.conversion.rateBp)}
                      value={`${data.conversion.depositPaidCount} of ${quotes(data.conversion.sentCount)}`}
                      note="of the quotes ever sent; a job closed later still counts"
                    />
                    <Section title="Deposits paid in the range" />
                    <Row
                      label="Deposits taken"
                      figure={count(data.deposits.count, data.deposits.count === 1 ? 'payment' : 'payments')}
                      value={formatMoney(data.deposits.takenCents)}
                    />
                    <Row
                      label="Refunded"
                      figure=""
                      value={formatMoney(data.deposits.refundedCents)}
                      note="of those deposits, so far"
                    />
                    <Row
                      label="Net deposits"
                      figure=""
                      value={formatMoney(data.deposits.netCents)}
                      note="taken − refunded"
                    />
                    <Row
                      label="Balances taken"
                      figure={count(data.balances.count, data.balances.count === 1 ? 'payment' : 'payments')}
                      value={formatMoney(data.balances.takenCents)}
                      note="online and at the counter"
                    />
                    <Section title="Margin on deposit-paid and closed quotes" />
                    <MarginRow label="Cams" m={data.margin.cams} />
                    <MarginRow label="Parts" m={data.margin.parts} />
                    <MarginRow label="Cams and parts" m={data.margin.total} />
                  </tbody>
                </table>
              </TableScroll>
              <div className="flex flex-col gap-6">
                <StatusChart bars={data.byStatus} />
                <TableScroll label="Most-quoted cams">
                  <table className={tableClass}>
                    <caption className="px-2 py-1.5 text-left text-sm font-semibold">Most-quoted cams</caption>
                    <thead>
                      <tr>
                        <th scope="col" className={thClass}>
                          Cam
                        </th>
                        <th scope="col" className={`${thClass} text-right`}>
                          Quoted
                        </th>
                        <th scope="col" className={`${thClass} text-right`}>
                          Deposit paid
                        </th>
                      </tr>
                    </thead>
                    <tbody>
                      {data.topCams.map((c) => (
                        <tr key={c.camId}>
                          <td className={tdClass}>
                            <span className="spec">{c.sku}</span> {c.name}
                          </td>
                          <td className={`${tdClass} spec whitespace-nowrap text-right`}>{quotes(c.quotes)}</td>
                          <td className={`${tdClass} spec whitespace-nowrap text-right`}>{quotes(c.deposits)}</td>
                        </tr>
                      ))}
                      {data.topCams.length === 0 ? (
                        <tr>
                          <td colSpan={3} className={`${tdClass} text-ink-muted`}>
                            No quote named a cam in this range.
                          </td>
                        </tr>
                      ) : null}
                    </tbody>
                  </table>
                </TableScroll>
              </div>
            </div>
          )}
          <p className="text-xs text-ink-muted">
            Margins use the catalogue’s current cost for each cam and part line. Amounts in US dollars ($). Quote values
            include tax; margins are on line prices before tax. The store keeps whole cents.
          </p>
        </>
      ) : null}
    </div>
  );
}
