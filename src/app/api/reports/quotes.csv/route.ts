import { requireRole } from '@/lib/auth/guard';
import { parseQuery } from '@/lib/catalogue/http';
import { quotesForExport } from '@/lib/db/queries/reports';
import { quotesToCsv } from '@/lib/reports/quotes-csv';
import { ReportRangeSchema } from '@/lib/schemas/report';

export const dynamic = 'force-dynamic';

/** Quotes created in ?from..to as CSV (formula-like cells neutralised). Managers only. */
export async function GET(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const range = parseQuery(request, ReportRangeSchema);
  if (!range.ok) return range.response;
  const csv = quotesToCsv(await quotesForExport(range.value));
  return new Response(`\uFEFF${csv}\r\n`, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="lobewise-quotes-${range.value.from}-to-${range.value.to}.csv"`,
      'Cache-Control': 'no-store',
    },
  });
}
