import type { ReportRange } from '@/lib/schemas/report';
import type { QuoteStatus } from '@/lib/db/models/quote';
import type { Margin } from './arithmetic';

// The manager's report as src/lib/db/queries/reports.ts works it out and the report page shows it (integer cents).

export type StatusFigure = { status: QuoteStatus; count: number; valueCents: number };

export type TopCam = { camId: number; sku: string; name: string; quotes: number; deposits: number };

export type ReportSummary = {
  range: ReportRange;
  created: { count: number; valueCents: number };
  byStatus: StatusFigure[];
  conversion: { sentCount: number; depositPaidCount: number; rateBp: number | null };
  averageQuoteCents: number | null;
  deposits: { count: number; takenCents: number; refundedCents: number; netCents: number };
  balances: { count: number; takenCents: number; refundedCents: number; netCents: number };
  margin: { cams: Margin; parts: Margin; total: Margin };
  topCams: TopCam[];
};
