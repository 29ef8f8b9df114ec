'use client';

import {
  Chart as ChartJS, Legend, LinearScale, LineElement, PointElement, Tooltip, type ChartDataset, type ChartOptions,
} from 'chart.js';
import { Line } from 'react-chartjs-2';
import { palette } from '@/lib/palette';

ChartJS.register(LinearScale, PointElement, LineElement, Tooltip, Legend);

export type ChartCurve = { label: string; points: { rpm: number; torqueLbFt: number; hp: number }[] };
export type ChartMarker = { label: string; rpm: number };

// Candidates differ by dash pattern and point shape as well as colour, so the chart still reads in
// print and for colour-blind readers. The baseline is always the same neutral solid grey.
const CANDIDATE_STYLES = [
  { color: palette.ember[500], dash: [], point: 'circle' },
  { color: palette.gauge[500], dash: [8, 4], point: 'triangle' },
  { color: palette.ember[700], dash: [2, 3], point: 'rect' },
  { color: palette.gauge[700], dash: [12, 3, 2, 3], point: 'rectRot' },
] as const;
const BASELINE = { color: palette.steel[500] };
const MARKER = palette.steel[700];

function series(curve: ChartCurve, index: number | null, metric: 'torqueLbFt' | 'hp'): ChartDataset<'line', { x: number; y: number }[]> {
  const style = index === null ? null : CANDIDATE_STYLES[index % CANDIDATE_STYLES.length];
  return {
    label: `${curve.label} — ${metric === 'hp' ? 'power (hp)' : 'torque (lb·ft)'}`,
    data: curve.points.map((p) => ({ x: p.rpm, y: p[metric] })),
    yAxisID: metric === 'hp' ? 'hp' : 'torque',
    borderColor: style?.color ?? BASELINE.color,
    backgroundColor: style?.color ?? BASELINE.color,
    borderDash: [...(style?.dash ?? [])],
    borderWidth: metric === 'hp' ? 2.5 : 1.5,
    pointStyle: style?.point ?? 'line',
    pointRadius: (ctx) => (ctx.dataIndex % 10 === 0 ? 3 : 0),
    tension: 0.2,
  };
}

export function PowerChart({ baseline, candidates, markers, band, description }: {
  baseline: ChartCurve; candidates: ChartCurve[]; markers: ChartMarker[]; band?: { fromRpm: number; toRpm: number; label: string };
  /** What the chart shows, for screen readers; defaults to the advisor's predicted curves. */
  description?: string;
}) {
  const all = [baseline, ...candidates];
  // The x range covers every curve: measured pulls need not share one rpm grid or start together.
  const rpms = all.flatMap((c) => c.points.map((p) => p.rpm));
  const [minRpm, maxRpm] = rpms.length ? [Math.min(...rpms), Math.max(...rpms)] : [undefined, undefined];
  const maxY = Math.max(...all.flatMap((c) => c.points.flatMap((p) => [p.hp, p.torqueLbFt])), 100);
  const markerSets: ChartDataset<'line', { x: number; y: number }[]>[] = markers.map((m) => ({
    label: `${m.label} (${m.rpm.toLocaleString('en-US')} rpm)`,
    data: [{ x: m.rpm, y: 0 }, { x: m.rpm, y: maxY }],
    yAxisID: 'torque',
    borderColor: MARKER,
    borderDash: [3, 3],
    borderWidth: 1,
    pointRadius: 0,
  }));
  const bandSets: ChartDataset<'line', { x: number; y: number }[]>[] = band
    ? [{
        label: band.label,
        data: [{ x: band.fromRpm, y: maxY * 0.04 }, { x: band.toRpm, y: maxY * 0.04 }],
        yAxisID: 'torque',
        borderColor: MARKER,
        borderWidth: 6,
        pointRadius: 0,
      }]
    : [];
  const data = {
    datasets: [
      series(baseline, null, 'torqueLbFt'), series(baseline, null, 'hp'),
      ...candidates.flatMap((c, i) => [series(c, i, 'torqueLbFt'), series(c, i, 'hp')]),
      ...markerSets, ...bandSets,
    ],
  };
  const options: ChartOptions<'line'> = {
    animation: false,
    responsive: true,
    maintainAspectRatio: false,
    interaction: { mode: 'nearest', intersect: false },
    scales: {
      x: { type: 'linear', title: { display: true, text: 'Engine speed (rpm)' }, min: minRpm, max: maxRpm },
      torque: { type: 'linear', position: 'left', title: { display: true, text: 'Torque (lb·ft)' }, min: 0, suggestedMax: maxY },
      hp: { type: 'linear', position: 'right', title: { display: true, text: 'Power (hp)' }, min: 0, suggestedMax: maxY, grid: { drawOnChartArea: false } },
    },
    plugins: { legend: { position: 'bottom', labels: { usePointStyle: true, boxWidth: 10, font: { size: 11 } } } },
  };
  return (
    <div className="h-96 w-full" role="img" aria-label={description ?? `Predicted torque and power from ${minRpm} to ${maxRpm} rpm for the current cam and ${candidates.length} candidates`}>
      <Line data={data} options={options} />
    </div>
  );
}
