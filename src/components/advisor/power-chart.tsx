'use client';

import {
  Chart as ChartJS,
  Filler,
  Legend,
  LinearScale,
  LineElement,
  PointElement,
  Tooltip,
  type ChartDataset,
  type ChartOptions,
} from 'chart.js';
import { useId, useState } from 'react';
import { Line } from 'react-chartjs-2';
import { palette } from '@/lib/palette';

ChartJS.register(LinearScale, PointElement, LineElement, Tooltip, Legend, Filler);

export type ChartPoint = {
  rpm: number;
  torqueLbFt: number;
  hp: number;
  torqueLowLbFt?: number;
  torqueHighLbFt?: number;
};
export type ChartCurve = { label: string; points: ChartPoint[] };
export type ChartMarker = { label: string; rpm: number };
/** An rpm range drawn as a bar under the curves in the colour of candidate `index` (e.g. its crossover range). */
export type ChartRange = { label: string; fromRpm: number; toRpm: number; index: number };
export type ChartMetric = 'torque' | 'power' | 'both';

// One colour, one dash pattern and one point shape per candidate, so the chart still reads in print and
// for colour-blind readers. The baseline is always the same neutral solid grey.
const CANDIDATE_STYLES = [
  { color: palette.ember[500], dash: [], point: 'circle' },
  { color: palette.gauge[500], dash: [8, 4], point: 'triangle' },
  { color: palette.ember[700], dash: [2, 3], point: 'rect' },
  { color: palette.gauge[700], dash: [12, 3, 2, 3], point: 'rectRot' },
] as const;
const BASELINE = { color: palette.steel[500], dash: [] as number[], point: 'line' };
const MARKER = palette.steel[700];
const BAND_ALPHA = '2e'; // about 18 % opacity, appended to the palette's #rrggbb

type Line = ChartDataset<'line', { x: number; y: number }[]>;
type Style = { color: string; dash: readonly number[]; point: string };

const styleOf = (index: number | null): Style =>
  index === null ? BASELINE : CANDIDATE_STYLES[index % CANDIDATE_STYLES.length];
const hpAt = (torque: number, rpm: number) => (torque * rpm) / 5252;

/** The curve itself, then (when the points carry a band) its low and high edges with the space between shaded. */
function curveSets(curve: ChartCurve, index: number | null, metric: 'torque' | 'power', labelSuffix: string): Line[] {
  const style = styleOf(index);
  const axis = metric === 'power' ? 'hp' : 'torque';
  const y = (p: ChartPoint) => (metric === 'power' ? p.hp : p.torqueLbFt);
  const main: Line = {
    label: `${curve.label}${labelSuffix}`,
    data: curve.points.map((p) => ({ x: p.rpm, y: y(p) })),
    yAxisID: axis,
    borderColor: style.color,
    backgroundColor: style.color,
    borderDash: [...style.dash],
    borderWidth: metric === 'power' ? 2.5 : 2,
    pointStyle: style.point as 'circle',
    pointRadius: (ctx) => (ctx.dataIndex % 10 === 0 ? 3 : 0),
    tension: 0.2,
  };
  const banded = curve.points.filter((p) => p.torqueLowLbFt !== undefined && p.torqueHighLbFt !== undefined);
  if (banded.length < 2) return [main];
  const edge = (pick: 'torqueLowLbFt' | 'torqueHighLbFt') =>
    banded.map((p) => ({ x: p.rpm, y: metric === 'power' ? hpAt(p[pick]!, p.rpm) : p[pick]! }));
  const quiet = { yAxisID: axis, borderWidth: 0, pointRadius: 0, tension: 0.2 };
  return [
    main,
    { ...quiet, label: '', data: edge('torqueLowLbFt'), borderColor: 'transparent', fill: false },
    {
      ...quiet,
      label: '',
      data: edge('torqueHighLbFt'),
      borderColor: 'transparent',
      backgroundColor: `${style.color}${BAND_ALPHA}`,
      fill: '-1',
    },
  ];
}

export function PowerChart({
  baseline,
  candidates,
  markers,
  band,
  ranges = [],
  description,
  initialMetric = 'both',
}: {
  baseline: ChartCurve;
  candidates: ChartCurve[];
  markers: ChartMarker[];
  band?: { fromRpm: number; toRpm: number; label: string };
  ranges?: ChartRange[];
  /** What the chart shows, for screen readers; defaults to the advisor's predicted curves. */
  description?: string;
  initialMetric?: ChartMetric;
}) {
  const [metric, setMetric] = useState<ChartMetric>(initialMetric);
  const name = useId();
  const all = [baseline, ...candidates];
  // The x range covers every curve: measured pulls need not share one rpm grid or start together.
  const rpms = all.flatMap((c) => c.points.map((p) => p.rpm));
  const [minRpm, maxRpm] = rpms.length ? [Math.min(...rpms), Math.max(...rpms)] : [undefined, undefined];
  const shown = (m: 'torque' | 'power') => metric === m || metric === 'both';
  const maxY = Math.max(
    ...all.flatMap((c) =>
      c.points.flatMap((p) => [
        shown('power') ? hpAt(p.torqueHighLbFt ?? p.torqueLbFt, p.rpm) : 0,
        shown('torque') ? (p.torqueHighLbFt ?? p.torqueLbFt) : 0,
      ]),
    ),
    100,
  );
  const axisFor = shown('torque') ? 'torque' : 'hp';
  const markerSets: Line[] = markers.map((m) => ({
    label: `${m.label} (${m.rpm.toLocaleString('en-US')} rpm)`,
    data: [
      { x: m.rpm, y: 0 },
      { x: m.rpm, y: maxY },
    ],
    yAxisID: axisFor,
    borderColor: MARKER,
    borderDash: [3, 3],
    borderWidth: 1,
    pointRadius: 0,
  }));
  const bandSets: Line[] = band
    ? [
        {
          label: band.label,
          data: [
            { x: band.fromRpm, y: maxY * 0.03 },
            { x: band.toRpm, y: maxY * 0.03 },
          ],
          yAxisID: axisFor,
          borderColor: MARKER,
          borderWidth: 6,
          pointRadius: 0,
        },
      ]
    : [];
  const rangeSets: Line[] = ranges.map((r, i) => ({
    label: r.label,
    data: [
      { x: r.fromRpm, y: maxY * (0.08 + 0.035 * i) },
      { x: r.toRpm, y: maxY * (0.08 + 0.035 * i) },
    ],
    yAxisID: axisFor,
    borderColor: styleOf(r.index).color,
    borderWidth: 4,
    pointRadius: 2,
    pointStyle: 'line',
  }));
  const suffix = (m: 'torque' | 'power') =>
    metric === 'both' ? (m === 'power' ? ' — power (hp)' : ' — torque (lb·ft)') : '';
  const curves = (m: 'torque' | 'power') =>
    shown(m)
      ? [curveSets(baseline, null, m, suffix(m)), ...candidates.map((c, i) => curveSets(c, i, m, suffix(m)))].flat()
      : [];
  const data = { datasets: [...curves('torque'), ...curves('power'), ...markerSets, ...bandSets, ...rangeSets] };
  const options: ChartOptions<'line'> = {
    animation: false,
    responsive: true,
    maintainAspectRatio: false,
    interaction: { mode: 'nearest', intersect: false },
    scales: {
      x: { type: 'linear', title: { display: true, text: 'Engine speed (rpm)' }, min: minRpm, max: maxRpm },
      torque: {
        type: 'linear',
        display: shown('torque'),
        position: 'left',
        title: { display: true, text: 'Torque (lb·ft)' },
        min: 0,
        suggestedMax: maxY,
      },
      hp: {
        type: 'linear',
        display: shown('power'),
        position: 'right',
        title: { display: true, text: 'Power (hp)' },
        min: 0,
        suggestedMax: maxY,
        grid: { drawOnChartArea: !shown('torque') },
      },
    },
    plugins: {
      // Band edges carry no label: one legend entry per curve, marker and range.
      legend: {
        position: 'bottom',
        labels: { usePointStyle: true, boxWidth: 10, font: { size: 11 }, filter: (item) => Boolean(item.text) },
      },
      tooltip: { filter: (item) => Boolean(item.dataset.label) },
    },
  };
  const hasBands = all.some((c) => c.points.some((p) => p.torqueLowLbFt !== undefined));
  return (
    <div className="flex flex-col gap-2">
      <fieldset className="flex flex-wrap items-center gap-3 text-sm print:hidden">
        <legend className="sr-only">Curves to show</legend>
        {(['torque', 'power', 'both'] as const).map((m) => (
          <label key={m} className="flex min-h-11 items-center gap-1.5">
            <input type="radio" name={name} value={m} checked={metric === m} onChange={() => setMetric(m)} />
            {m === 'torque' ? 'Torque' : m === 'power' ? 'Power' : 'Both'}
          </label>
        ))}
        {hasBands ? <span className="text-xs text-ink-muted">Shaded: the prediction’s band</span> : null}
      </fieldset>
      <div
        className="h-96 w-full"
        role="img"
        aria-label={
          description ??
          `Predicted ${metric === 'both' ? 'torque and power' : metric} from ${minRpm} to ${maxRpm} rpm for the current cam and ${candidates.length} candidates, each with its band`
        }
      >
        {/* The box above names the chart; the canvas itself (role="img" from react-chartjs-2) is left out. */}
        <Line data={data} options={options} aria-hidden />
      </div>
    </div>
  );
}
