'use client';

import type { ShopRankingEntry } from '@/lib/ranking/types';
import { SCORING_WEIGHTS, type SubscoreName } from '@/lib/advisor/weights';
import { MakeQuoteButton } from '@/components/quotes/make-quote-button';
import type { BuildProfile } from '@/lib/schemas/build-profile';
import { useState } from 'react';
import { degText, formatMoney, pctText, rpmRangeText, rpmText } from '@/lib/format';
import { ModelFigures } from './model-figures';

type Ranking = ShopRankingEntry;

const SUBSCORE_LABELS: Record<SubscoreName, string> = {
  powerband: 'Power where it’s driven',
  converter: 'Converter / launch',
  idle: 'Idle and vacuum',
  compression: 'Compression and fuel',
  fit: 'Fit and valvetrain',
  emissions: 'Emissions',
  cost: 'Cost against budget',
};

export function RankingDetail({
  ranking,
  buildId,
  build,
}: {
  ranking: Ranking;
  buildId?: number;
  build?: BuildProfile;
}) {
  const v = ranking.valveEvents;
  const [explaining, setExplaining] = useState(false);
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <section>
        <h3 className="text-sm font-semibold">Why it ranks here</h3>
        <ul className="mt-2 flex flex-col gap-1.5 text-sm">
          {ranking.reasons.map((reason, i) => (
            <li key={i} className="flex gap-2">
              <span className="spec w-14 shrink-0 text-right text-ink-muted">
                {(ranking.subscores[reason.subscore] ?? 0).toFixed(0)}/100
              </span>
              <span>
                <span className="font-semibold">{SUBSCORE_LABELS[reason.subscore]}:</span> {reason.text}
              </span>
            </li>
          ))}
        </ul>
        {ranking.cautions.length ? (
          <>
            <h3 className="mt-4 text-sm font-semibold">Cautions</h3>
            <ul className="mt-1 list-disc pl-5 text-sm text-caution-700">
              {ranking.cautions.map((c, i) => (
                <li key={i}>
                  <span className="font-semibold">Caution ({c.kind}):</span> {c.text}
                </li>
              ))}
            </ul>
          </>
        ) : null}
      </section>
      <section>
        {ranking.history ? (
          <div className="mb-3 rounded border border-gauge-500/40 bg-gauge-100 p-2 text-sm text-gauge-700">
            <h3 className="font-semibold">
              Measured on {ranking.history.matches} similar build{ranking.history.matches === 1 ? '' : 's'} in this shop
            </h3>
            <p>
              Measured peak-power gain {pctText(ranking.history.measuredGainPctPeakHp)} (dyno, corrected to standard
              air) against the model’s indicative {pctText(ranking.history.modelGainPctPeakHp)}; the prediction shown
              uses {pctText(ranking.history.adjustedGainPctPeakHp)}, weighing the model as two perfectly similar jobs.
            </p>
          </div>
        ) : null}
        <h3 className="text-sm font-semibold">What the job then needs</h3>
        <ul className="mt-1 list-disc pl-5 text-sm">
          {ranking.needs.map((n, i) => (
            <li key={i}>{n.reason}</li>
          ))}
        </ul>
        {ranking.neededItems.length ? (
          <table className="spec mt-2 w-full text-xs">
            <caption className="sr-only">Parts and labour from the shop’s rules</caption>
            <tbody>
              {ranking.neededItems.map((item, i) => (
                <tr key={i} className="border-t border-steel-100">
                  <td className="py-1 font-sans">
                    {item.part
                      ? `${item.part.sku} ${item.part.name}`
                      : `${item.laborOperation?.name} (${item.laborOperation?.hours} h)`}
                  </td>
                  <td className="py-1 text-right">{formatMoney(item.priceCents)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
        <p className="mt-2 text-sm">
          <span className="font-semibold">Job before tax:</span>{' '}
          <span className="spec">{formatMoney(ranking.jobPriceCents)}</span>{' '}
          <span className="text-ink-muted">(cam, the parts and labour above, and the tune)</span>
        </p>
        {buildId ? <MakeQuoteButton buildId={buildId} camId={ranking.camId} /> : null}
        <details className="mt-4 text-sm" onToggle={(e) => setExplaining(e.currentTarget.open)}>
          <summary className="cursor-pointer font-semibold">How these numbers were reached</summary>
          <dl className="spec mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-xs">
            <dt>Valve events at 0.050&quot;</dt>
            <dd>
              IVO {degText(v.ivo)} BTDC · IVC {degText(v.ivc)} ABDC · EVO {degText(v.evo)} BBDC · EVC {degText(v.evc)}{' '}
              ATDC · overlap {degText(v.overlap)} · exhaust centerline {degText(v.exhaustCenterline)}
            </dd>
            <dt>Formula</dt>
            <dd className="font-sans">
              IVO = dur/2 − ICL; IVC = dur/2 + ICL − 180; ECL = 2·LSA − ICL; EVO = dur/2 + ECL − 180; EVC = dur/2 − ECL
              (cam-card arithmetic, common practice)
            </dd>
            <dt>Dynamic compression</dt>
            <dd>
              {ranking.dynamicCompression.toFixed(2)}:1{' '}
              <span className="font-sans">
                — swept volume left after the intake closes, piston position by the slider-crank relation (Heywood, ch.
                2)
              </span>
            </dd>
            <dt>Idle vacuum</dt>
            <dd>
              about {ranking.idleVacuumInHg.toFixed(1)} inHg{' '}
              <span className="font-sans">
                — estimated from overlap and cylinder size (common practice; vacuum brake boosters want about 15+)
              </span>
            </dd>
            <dt>Crossover</dt>
            <dd>
              {ranking.crossoverRpm === null ? 'never in range' : rpmText(ranking.crossoverRpm)}
              {ranking.crossoverRangeRpm ? ` (range ${rpmRangeText(ranking.crossoverRangeRpm)})` : ''}{' '}
              <span className="font-sans">
                — first rpm from which the predicted torque stays above the current cam’s; the range moves the
                candidate’s gain by the model’s calibration uncertainty
              </span>
            </dd>
            <dt>Power</dt>
            <dd>
              <span className="font-sans">
                hp = torque (lb·ft) × rpm ÷ 5252 (definition of horsepower, 33,000 ft·lbf/min)
              </span>
            </dd>
            <dt>Score</dt>
            <dd>
              {(Object.keys(SCORING_WEIGHTS) as SubscoreName[])
                .map(
                  (name) =>
                    `${SUBSCORE_LABELS[name]} ${ranking.subscores[name].toFixed(0)} × ${SCORING_WEIGHTS[name]}%`,
                )
                .join(' + ')}{' '}
              = {ranking.score.toFixed(0)}
            </dd>
            {ranking.history ? (
              <>
                <dt>Shop’s own results</dt>
                <dd>
                  {ranking.history.matches} similar job(s): model {ranking.history.modelGainPctPeakHp.toFixed(1)} %,
                  measured {ranking.history.measuredGainPctPeakHp.toFixed(1)} %, used{' '}
                  {ranking.history.adjustedGainPctPeakHp.toFixed(1)} %
                </dd>
              </>
            ) : null}
          </dl>
          {explaining && build && typeof ranking.camId === 'number' ? (
            <ModelFigures build={build} camId={ranking.camId} />
          ) : null}
        </details>
      </section>
    </div>
  );
}
