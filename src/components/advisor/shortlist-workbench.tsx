'use client';

import { useMemo, useState } from 'react';
import useSWR from 'swr';
import type { ShopRanking } from '@/lib/ranking/types';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import { formatMoney, hpText, pctText, rpmRangeText, rpmText, torqueText } from '@/lib/format';
import { ChosenCams } from './chosen-cams';
import { PowerChart } from './power-chart';
import { RankingDetail } from './ranking-detail';
import { postForJson } from '@/lib/api-client';

type BuildOption = { id: number; label: string; profile: BuildProfile };

async function rank([url, build, camIds]: [string, BuildProfile, string?]): Promise<ShopRanking> {
  // camIds (comma-separated, so the SWR key stays a plain value): just these cams, curves and all.
  const ids = camIds ? camIds.split(',').map(Number) : undefined;
  const body = ids ? { build, camIds: ids, curveLimit: ids.length } : { build };
  return postForJson<ShopRanking>(url, body);
}

export function ShortlistWorkbench({
  builds,
  notice,
  initialBuildId,
}: {
  builds: BuildOption[];
  notice: string;
  initialBuildId?: number;
}) {
  // No silent default: the person picks the customer's build (the page preselects one only from ?build=).
  const [buildId, setBuildId] = useState<number | null>(initialBuildId ?? null);
  const build = builds.find((b) => b.id === buildId) ?? null;
  const { data, error, isLoading } = useSWR(build ? ['/api/advisor/rank', build.profile] : null, rank, {
    revalidateOnFocus: false,
  });
  const [openCamId, setOpenCamId] = useState<string | null>(null);
  const [charted, setCharted] = useState<string[] | null>(null);
  // Off at first: the whole ranking, uncertified cams marked; the counter narrows it for a road-legal build.
  const [certifiedOnly, setCertifiedOnly] = useState(false);
  const shown = useMemo(
    () => (data ? data.rankings.filter((r) => !certifiedOnly || r.emissionsCertified) : []),
    [data, certifiedOnly],
  );

  const chartIds = useMemo(() => charted ?? shown.slice(0, 3).map((r) => String(r.camId)), [charted, shown]);
  // The answer carries curves for the top of the list only; a cam charted from further down is asked for on its own.
  const withoutCurve = data
    ? chartIds.filter((id) => data.rankings.find((r) => String(r.camId) === id)?.curve.length === 0)
    : [];
  const { data: extra } = useSWR(
    build && withoutCurve.length ? ['/api/advisor/rank', build.profile, withoutCurve.join(',')] : null,
    rank,
    { revalidateOnFocus: false },
  );
  const curveOf = (r: ShopRanking['rankings'][number]) =>
    r.curve.length ? r.curve : (extra?.rankings.find((x) => String(x.camId) === String(r.camId))?.curve ?? []);

  if (builds.length === 0) {
    return (
      <p className="rounded border border-steel-300 bg-paper-raised p-4">
        No saved builds yet. Record a customer’s engine combination first, then come back here for the shortlist.
      </p>
    );
  }

  const toggleChart = (camId: string) =>
    setCharted((current) => {
      const list = current ?? chartIds;
      return list.includes(camId) ? list.filter((id) => id !== camId) : [...list, camId].slice(-4);
    });

  return (
    <div className="flex flex-col gap-4">
      <label className="flex max-w-xl flex-col gap-1 text-sm font-semibold">
        Build
        <select
          className="rounded border border-steel-300 bg-paper-raised px-3 py-2 font-normal"
          value={buildId ?? ''}
          onChange={(e) => {
            setBuildId(Number(e.target.value));
            setCharted(null);
            setOpenCamId(null);
            setCertifiedOnly(false);
          }}
        >
          {buildId === null ? (
            <option value="" disabled>
              Pick a build…
            </option>
          ) : null}
          {builds.map((b) => (
            <option key={b.id} value={b.id}>
              {b.label}
            </option>
          ))}
        </select>
      </label>
      {buildId === null ? (
        <p className="text-sm text-ink-soft">Pick the customer’s build above to rank the shop’s cams for it.</p>
      ) : null}

      {isLoading ? (
        <p role="status" className="text-sm text-ink-soft">
          Ranking the catalogue for this build…
        </p>
      ) : null}
      {error ? (
        <p role="alert" className="rounded border border-fault-700/40 bg-fault-100 p-3 text-sm text-fault-700">
          Problem: {error.message} Check the build’s details and try again.
        </p>
      ) : null}

      {data && build ? (
        <>
          <EngineLine data={data} />
          <section aria-labelledby="chart-heading" className="rounded-lg border border-steel-300 bg-paper-raised p-4">
            <h2 id="chart-heading" className="text-sm font-semibold">
              Predicted curves against the cam in the engine now
            </h2>
            <PowerChart
              baseline={{ label: `Now: ${data.baseline.camName}`, points: data.baseline.curve }}
              candidates={shown
                .filter((r) => chartIds.includes(String(r.camId)))
                .map((r) => ({ label: `#${r.rank} ${r.camName}`, points: curveOf(r) }))}
              markers={
                (build.profile.drivetrain.stallRpm ?? 0) > 0
                  ? [{ label: 'Converter stall', rpm: build.profile.drivetrain.stallRpm ?? 0 }]
                  : []
              }
              band={{
                fromRpm: data.engine.cruiseRpm,
                toRpm: Math.max(data.engine.cruiseRpm + 200, data.engine.pullAwayRpm),
                label: `Where it’s driven (cruise ${Math.round(data.engine.cruiseRpm)} rpm)`,
              }}
              ranges={shown
                .filter((r) => chartIds.includes(String(r.camId)))
                .flatMap((r, index) =>
                  r.crossoverRangeRpm === null
                    ? []
                    : [
                        {
                          label: `#${r.rank} out-pulls now from ${rpmRangeText(r.crossoverRangeRpm)}`,
                          fromRpm: r.crossoverRangeRpm[0],
                          toRpm: r.crossoverRangeRpm[1],
                          index,
                        },
                      ],
                )}
              initialMetric="torque"
            />
            <p className="mt-2 text-xs text-ink-muted">{notice}</p>
          </section>

          <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
            <label className="flex items-center gap-2">
              <input
                type="checkbox"
                checked={certifiedOnly}
                onChange={(e) => {
                  setCertifiedOnly(e.target.checked);
                  setCharted(null);
                }}
              />
              Only emissions-certified cams
            </label>
            <span role="status" className="text-ink-soft">
              {certifiedOnly
                ? `${shown.length} of ${data.rankings.length} cams shown; ${data.rankings.length - shown.length} not certified left out.`
                : `All ${data.rankings.length} cams shown.`}
            </span>
          </div>
          <ChosenCams
            cams={shown.filter((r) => chartIds.includes(String(r.camId))).map((r) => ({ ...r, curve: curveOf(r) }))}
            baseline={data.baseline}
            displacementL={data.engine.displacementL}
            stallRpm={build.profile.drivetrain.stallRpm ?? 0}
            drivenBand={{
              fromRpm: data.engine.cruiseRpm,
              toRpm: Math.max(data.engine.cruiseRpm + 200, data.engine.pullAwayRpm),
            }}
            notice={notice}
          />
          <div className="overflow-x-auto rounded-lg border border-steel-300 bg-paper-raised">
            <table className="w-full text-sm">
              <caption className="sr-only">Cams ranked for this build</caption>
              <thead className="bg-paper-sunk text-left text-xs uppercase tracking-wide text-ink-muted">
                <tr>
                  <th scope="col" className="px-3 py-2">
                    #
                  </th>
                  <th scope="col" className="px-3 py-2">
                    Cam
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Fit
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Out-pulls now from
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Peak power
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Peak torque
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Low-end loss
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Job before tax
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    On hand
                  </th>
                  <th scope="col" className="px-3 py-2">
                    Chart
                  </th>
                </tr>
              </thead>
              <tbody className="spec">
                {shown.map((r) => {
                  const id = String(r.camId);
                  const open = openCamId === id;
                  return (
                    <RowGroup key={id}>
                      <tr className="border-t border-steel-100">
                        <td className="px-3 py-2">{r.rank}</td>
                        <td className="px-3 py-2 font-sans">
                          <button
                            type="button"
                            aria-expanded={open}
                            className="text-left font-semibold underline-offset-2 hover:underline"
                            onClick={() => setOpenCamId(open ? null : id)}
                          >
                            {r.camName}
                          </button>
                          {r.history ? (
                            <span className="ml-2 rounded bg-gauge-100 px-1.5 text-xs text-gauge-700">
                              Measured on {r.history.matches} similar build{r.history.matches === 1 ? '' : 's'}:{' '}
                              {pctText(r.history.measuredGainPctPeakHp)}
                            </span>
                          ) : null}
                          {r.subscores.emissions < 100 ? (
                            <span className="ml-2 rounded bg-caution-100 px-1.5 text-xs text-caution-700">
                              Emissions: not certified
                            </span>
                          ) : null}
                        </td>
                        <td className="px-3 py-2 text-right">{r.score.toFixed(0)}/100</td>
                        <td className="px-3 py-2 text-right">
                          {r.crossoverRangeRpm === null ? 'never' : rpmRangeText(r.crossoverRangeRpm)}
                        </td>
                        <td className="px-3 py-2 text-right">
                          {hpText(r.predicted.peakHp)}{' '}
                          <span className="text-ink-muted">({pctText(r.predicted.gainPctPeakHp)})</span>
                        </td>
                        <td className="px-3 py-2 text-right">{torqueText(r.predicted.peakTorqueLbFt)}</td>
                        <td className="px-3 py-2 text-right">{r.predicted.lowEndLossPct.toFixed(1)} %</td>
                        {/* The one job price (cam, needed parts and labour, tune): a quote drafted from this row totals the same before tax. */}
                        <td className="px-3 py-2 text-right" data-job-price>
                          {formatMoney(r.jobPriceCents)}
                        </td>
                        <td className="whitespace-nowrap px-3 py-2 text-right">
                          {r.stockOnHand > 0 ? (
                            `${r.stockOnHand} in stock`
                          ) : (
                            <span className="font-sans text-caution-700">None: order</span>
                          )}
                        </td>
                        <td className="px-3 py-2">
                          <input
                            type="checkbox"
                            aria-label={`Show ${r.camName} on the chart`}
                            checked={chartIds.includes(id)}
                            onChange={() => toggleChart(id)}
                          />
                        </td>
                      </tr>
                      {open ? (
                        <tr>
                          <td colSpan={10} className="bg-paper px-3 py-3 font-sans">
                            <RankingDetail ranking={r} buildId={buildId ?? undefined} build={build.profile} />
                          </td>
                        </tr>
                      ) : null}
                    </RowGroup>
                  );
                })}
              </tbody>
            </table>
          </div>
          {data.ruledOut.length ? (
            <p className="text-sm text-ink-soft">
              {data.ruledOut.length} more cam{data.ruledOut.length === 1 ? '' : 's'} could not reach the top ten for
              this build whatever their curves (best possible score{' '}
              {Math.max(...data.ruledOut.map((x) => x.maxScore)).toFixed(0)}/100), so they were not modelled.
            </p>
          ) : null}
        </>
      ) : null}
    </div>
  );
}

function RowGroup({ children }: { children: React.ReactNode }) {
  return <>{children}</>;
}

function EngineLine({ data }: { data: ShopRanking }) {
  const e = data.engine;
  return (
    <p className="spec text-sm text-ink-soft">
      {e.displacementCi.toFixed(0)} in³ ({e.displacementL.toFixed(1)} L) · cruise {rpmText(e.cruiseRpm)} · pulls away
      near {rpmText(e.pullAwayRpm)} · curves to {rpmText(e.rpmLimit)} · head flow supports about{' '}
      {hpText(e.headFlowCeilingHp)}
    </p>
  );
}
