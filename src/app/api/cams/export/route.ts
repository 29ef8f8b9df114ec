import { requireRole } from '@/lib/auth/guard';
import { camsToCsv } from '@/lib/catalogue/cam-csv';
import { canSeeCosts } from '@/lib/http/kit';
import { allCams } from '@/lib/db/queries/cams';

export const dynamic = 'force-dynamic';

/** The whole cam catalogue as CSV, in the import's columns (costs left out for technicians). */
export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const csv = camsToCsv(await allCams(), { includeCosts: canSeeCosts(user) });
  const date = new Date().toISOString().slice(0, 10);
  return new Response(`\uFEFF${csv}\r\n`, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="lobewise-cams-${date}.csv"`,
      'Cache-Control': 'no-store',
    },
  });
}
