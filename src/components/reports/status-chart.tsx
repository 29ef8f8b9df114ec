'use client';

import {
  BarElement,
  CategoryScale,
  Chart as ChartJS,
  LinearScale,
  Tooltip,
  type ChartOptions,
  type Plugin,
} from 'chart.js';
import { Bar } from 'react-chartjs-2';
import { quoteStatusWord } from '@/components/quotes/status';
import { palette } from '@/lib/palette';

ChartJS.register(CategoryScale, LinearScale, BarElement, Tooltip);

export type StatusBar = { status: string; count: number };

// Horizontal bars take the state's tone (the same tones as the status tags), but the state's word is
// written beside every bar and the count at its end, so colour never carries the meaning alone.
const TONE: Record<string, string> = {
  draft: palette.steel[500],
  sent: palette.gauge[500],
  accepted: palette.gauge[700],
  'deposit-paid': palette.ok[700],
  declined: palette.fault[700],
  expired: palette.ember[700],
  cancelled: palette.steel[700],
};

const countsOnBars: Plugin<'bar'> = {
  id: 'lobewiseCountsOnBars',
  afterDatasetsDraw(chart) {
    const { ctx } = chart;
    const meta = chart.getDatasetMeta(0);
    const values = chart.data.datasets[0]?.data ?? [];
    ctx.save();
    ctx.fillStyle = palette.ink.DEFAULT;
    ctx.font = '600 12px ui-monospace, monospace';
    ctx.textAlign = 'left';
    ctx.textBaseline = 'middle';
    meta.data.forEach((bar, i) => {
      const value = Number(values[i] ?? 0);
      ctx.fillText(`${value} ${value === 1 ? 'quote' : 'quotes'}`, bar.x + 6, bar.y);
    });
    ctx.restore();
  },
};

export function StatusChart({ bars }: { bars: StatusBar[] }) {
  const max = Math.max(1, ...bars.map((b) => b.count));
  const data = {
    labels: bars.map((b) => quoteStatusWord(b.status)),
    datasets: [
      {
        label: 'Quotes created in the range, by state now',
        data: bars.map((b) => b.count),
        backgroundColor: bars.map((b) => TONE[b.status] ?? palette.steel[500]),
        borderColor: palette.ink.soft,
        borderWidth: 1,
        maxBarThickness: 22,
      },
    ],
  };
  const options: ChartOptions<'bar'> = {
    animation: false,
    responsive: true,
    maintainAspectRatio: false,
    indexAxis: 'y',
    layout: { padding: { right: 72 } },
    plugins: { legend: { display: false }, tooltip: { callbacks: { label: (item) => `${item.parsed.x} quotes` } } },
    scales: {
      y: { ticks: { color: palette.ink.DEFAULT, autoSkip: false }, grid: { display: false } },
      x: {
        beginAtZero: true,
        suggestedMax: max,
        ticks: { precision: 0, color: palette.ink.muted },
        grid: { color: palette.steel[100] },
        title: { display: true, text: 'quotes', color: palette.ink.muted },
      },
    },
  };
  const summary = bars.map((b) => `${quoteStatusWord(b.status)}: ${b.count}`).join(', ');
  return (
    <figure className="flex flex-col gap-1">
      <div className="h-56" role="img" aria-label={`Bar chart of quotes by state. ${summary}.`}>
        {/* The box above names the chart; the canvas itself (role="img" from react-chartjs-2) is left out. */}
        <Bar data={data} options={options} plugins={[countsOnBars]} aria-hidden />
      </div>
      <figcaption className="text-xs text-ink-muted">
        Quotes created in the range, by the state they are in now.
      </figcaption>
    </figure>
  );
}
