import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { ReportPanel } from '@/components/reports/report-panel';
import { requireAccessForPage } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Numbers' };

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;

export default async function ReportsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  await requireAccessForPage('reports.read');
  const raw = await searchParams;
  const from = one(raw.from);
  const to = one(raw.to);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Numbers"
        lead="Quotes, deposits and margins for a date range. Without dates: the last 30 days."
      />
      <ReportPanel key={`${from ?? ''}|${to ?? ''}`} from={from} to={to} />
    </div>
  );
}
