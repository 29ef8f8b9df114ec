import { NextResponse } from 'next/server';
import { reportSummary } from '@/lib/db/queries/reports';
import { route } from '@/lib/http/route';
import { ReportRangeSchema } from '@/lib/schemas/report';

/** The manager's numbers for ?from=YYYY-MM-DD&to=YYYY-MM-DD (default: the last 30 days). */
export const GET = route({ permission: 'reports.read', query: ReportRangeSchema }, async ({ query }) =>
  NextResponse.json(await reportSummary(query), { headers: { 'Cache-Control': 'no-store' } }),
);
