import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { parseQuery } from '@/lib/http/kit';
import { reportSummary } from '@/lib/db/queries/reports';
import { ReportRangeSchema } from '@/lib/schemas/report';

export const dynamic = 'force-dynamic';

/** The manager's numbers for ?from=YYYY-MM-DD&to=YYYY-MM-DD (default: the last 30 days). */
export async function GET(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const range = parseQuery(request, ReportRangeSchema);
  if (!range.ok) return range.response;
  return NextResponse.json(await reportSummary(range.value), { headers: { 'Cache-Control': 'no-store' } });
}
