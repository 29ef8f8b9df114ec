import { requireRole } from '@/lib/auth/guard';
import { camTemplateCsv } from '@/lib/catalogue/cam-csv';

export const dynamic = 'force-dynamic';

/** The cam spreadsheet template: the header row and one example row. */
export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  return new Response(`${camTemplateCsv()}\r\n`, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': 'attachment; filename="lobewise-cams-template.csv"',
      'Cache-Control': 'no-store',
    },
  });
}
