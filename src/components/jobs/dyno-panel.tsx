'use client';

import { useState } from 'react';
import useSWR from 'swr';
import { PowerChart, type ChartCurve } from '@/components/advisor/power-chart';
import { Button } from '@/components/ui/button';
import { tableClass, tdClass, thClass } from '@/components/ui/table';
import type { DynoRunView } from '@/lib/dyno/types';
import { DYNO_TYPE_WORDS } from '@/lib/dyno/dyno-type';
import { AIR_DIGITS, AIR_UNIT_TEXT, baroIn, tempIn, type AirUnits } from '@/lib/dyno/units';
import { DynoRunForm } from './dyno-run-form';
import { usePredictedCurve } from './use-predicted-curve';
import { getJson, sendJson } from '@/lib/api-client';
import type { BuildProfile } from '@/lib/schemas/build-profile';

// The job's dyno runs: measured figures, observed and corrected, a chart of before against after
// (corrected curves; the before pull is drawn the neutral baseline way), and the form to add one.

const fetchRuns = (url: string) => getJson<{ runs: DynoRunView[] }>(url).then((body) => body.runs);

const STANDARD_NAMES: Record<string, string> = {
  'sae-j1349': 'SAE J1349',
  'sae-j607': 'SAE J607',
  'din-70020': 'DIN 70020',
  none: 'none',
};
const fixed = (n: number | null | undefined, digits: number, unit: string) =>
  n === null || n === undefined ? '—' : `${n.toFixed(digits)} ${unit}`;
// Shown in the units of the shop's setting; stored in °C and kPa.
function airText(air: DynoRunView['air'], units: AirUnits): string {
  const u = AIR_UNIT_TEXT[units];
  const d = AIR_DIGITS[units];
  const temp = air.airTempC === null ? null : tempIn(units, air.airTempC);
  const baro = air.baroKpa === null ? null : baroIn(units, air.baroKpa);
  return `${fixed(temp, d.temp, u.temp)} · ${fixed(baro, d.baro, u.baro)} · ${fixed(air.humidityPct, 0, '%')}`;
}
const when = (iso: string) => iso.slice(0, 16).replace('T', ' ');

function curveOf(run: DynoRunView): ChartCurve | null {
  if (!run.correctedCurve) return null;
  return {
    label: `${run.phase === 'before' ? 'Before' : 'After'} · ${DYNO_TYPE_WORDS[run.dynoType].short.toLowerCase()} dyno · ${run.camName ?? 'cam not named'} · ${when(run.runAt)} (measured, ${run.correction ? STANDARD_NAMES[run.correction.standard] : 'uncorrected'})`,
    points: run.correctedCurve,
  };
}

export function DynoPanel({
  buildId,
  quoteId,
  profile,
  units,
}: {
  buildId: number;
  quoteId: number;
  profile: BuildProfile | null;
  /** The shop's setting (shop_settings.dyno_air_units): how the air is typed and shown. */
  units: AirUnits;
}) {
  const { data, error, isLoading, mutate } = useSWR(`/api/dyno-runs?buildId=${buildId}`, fetchRuns);
  const [message, setMessage] = useState<string | null>(null);
  const runs = data ?? [];
  const before = runs.filter((r) => r.phase === 'before' && r.correctedCurve).at(-1);
  const baseline = before ? curveOf(before) : null;
  // Wheel and flywheel figures differ by the driveline's loss: the chart compares one kind of dyno only.
  const chartType =
    before?.dynoType ?? runs.filter((r) => r.phase === 'after' && r.correctedCurve).at(-1)?.dynoType ?? 'chassis';
  const afterRuns = runs.filter((r) => r.phase === 'after' && r.correctedCurve);
  const afters = afterRuns
    .filter((r) => r.dynoType === chartType)
    .map(curveOf)
    .filter((c): c is ChartCurve => c !== null);
  const leftOut = afterRuns.length - afters.length;
  const fittedCamId = afterRuns.filter((r) => r.dynoType === chartType).at(-1)?.camId ?? null;
  const prediction = usePredictedCurve(profile, buildId, fittedCamId, chartType === 'engine');
  const predicted = prediction.data ?? null;

  async function remove(run: DynoRunView) {
    if (!window.confirm(`Delete the ${run.phase} run of ${when(run.runAt)}? The audit log keeps what it said.`)) return;
    const answer = await sendJson('DELETE', `/api/dyno-runs/${run.id}`);
    setMessage(answer.ok ? 'Run deleted.' : `The run was not deleted (${answer.status}).`);
    await mutate();
  }

  return (
    <section aria-labelledby="dyno-title" className="flex flex-col gap-4">
      <h2 id="dyno-title" className="text-lg font-semibold">
        Dyno runs
      </h2>
      <p className="text-sm text-ink-soft">
        These are measured results. Once a build has a before and an after pull, the advisor counts the measured gain
        for similar builds next to its indicative prediction.
      </p>
      {error ? (
        <p role="alert" className="text-sm text-fault-700">
          {(error as Error).message}
        </p>
      ) : null}
      {isLoading ? <p className="text-sm text-ink-muted">Loading runs…</p> : null}
      {message ? (
        <p role="status" className="text-sm">
          {message}
        </p>
      ) : null}
      {runs.length ? (
        <table className={tableClass}>
          <caption className="sr-only">Recorded dyno runs, observed and corrected</caption>
          <thead>
            <tr>
              <th scope="col" className={thClass}>
                Pull
              </th>
              <th scope="col" className={thClass}>
                Dyno
              </th>
              <th scope="col" className={thClass}>
                When (UTC)
              </th>
              <th scope="col" className={thClass}>
                Cam
              </th>
              <th scope="col" className={thClass}>
                Air
              </th>
              <th scope="col" className={`${thClass} text-right`}>
                Peak power observed
              </th>
              <th scope="col" className={`${thClass} text-right`}>
                Peak torque observed
              </th>
              <th scope="col" className={`${thClass} text-right`}>
                Correction
              </th>
              <th scope="col" className={`${thClass} text-right`}>
                Corrected power · torque
              </th>
              <th scope="col" className={`${thClass} print:hidden`}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {runs.map((run) => (
              <tr key={run.id}>
                <td className={tdClass}>{run.phase === 'before' ? 'Before' : 'After'}</td>
                <td className={tdClass}>{DYNO_TYPE_WORDS[run.dynoType].short}</td>
                <td className={`${tdClass} spec`}>{when(run.runAt)}</td>
                <td className={`${tdClass} spec`}>{run.camName ?? '—'}</td>
                <td className={`${tdClass} spec`}>{airText(run.air, units)}</td>
                <td className={`${tdClass} spec text-right`}>
                  {fixed(run.observed.peakHp, 1, 'hp')} @ {run.observed.peakHpRpm ?? '—'} rpm
                </td>
                <td className={`${tdClass} spec text-right`}>
                  {fixed(run.observed.peakTorqueLbFt, 1, 'lb·ft')} @ {run.observed.peakTorqueRpm ?? '—'} rpm
                </td>
                <td
                  className={`${tdClass} spec text-right`}
                  title={run.correction ? `${run.correction.formula} — ${run.correction.source}` : 'no air data'}
                >
                  {run.correction
                    ? `${STANDARD_NAMES[run.correction.standard]} × ${run.correction.factor.toFixed(4)}`
                    : '—'}
                </td>
                <td className={`${tdClass} spec text-right`}>
                  {fixed(run.corrected?.peakHp, 1, 'hp')} · {fixed(run.corrected?.peakTorqueLbFt, 1, 'lb·ft')}
                </td>
                <td className={`${tdClass} print:hidden`}>
                  <Button type="button" variant="danger" onClick={() => remove(run)}>
                    Delete
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : !isLoading && !error ? (
        <p className="text-sm text-ink-muted">No runs recorded for this build yet.</p>
      ) : null}
      {baseline || afters.length ? (
        <figure className="rounded border border-steel-100 bg-paper-raised p-3">
          <PowerChart
            baseline={baseline ?? { label: 'Before (no pull recorded as a curve)', points: [] }}
            candidates={predicted ? [...afters, predicted] : afters}
            markers={[]}
            description={`Measured, corrected torque and power on the ${chartType} dyno: the before pull (solid grey) and ${afters.length} after pull(s)${predicted ? ', with the advisor’s predicted curve for the fitted cam and its band' : ''}, rpm across`}
          />
          <figcaption className="mt-2 text-xs text-ink-muted">
            Measured on this shop’s dyno and corrected to standard air. Torque on the left axis, power on the right;
            power = lb·ft × rpm ÷ 5252. Runs recorded as peak figures only are in the table, not the chart.
            {predicted
              ? ' The advisor’s prediction for this build and cam is drawn with its shaded band (flywheel figures at standard air, so only over engine-dyno pulls); this build’s own pulls are not part of it.'
              : null}
            {chartType === 'engine' && prediction.error ? ` ${(prediction.error as Error).message}` : null}
            {leftOut
              ? ` ${leftOut} after pull${leftOut === 1 ? '' : 's'} on the ${chartType === 'chassis' ? 'engine' : 'chassis'} dyno ${leftOut === 1 ? 'is' : 'are'} left out: a ${chartType} run is compared only with ${chartType} runs.`
              : ''}
          </figcaption>
        </figure>
      ) : null}
      <div className="rounded border border-steel-100 bg-paper-raised p-3 print:hidden">
        <DynoRunForm buildId={buildId} quoteId={quoteId} units={units} onSaved={() => void mutate()} />
      </div>
    </section>
  );
}
