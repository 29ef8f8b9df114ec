import { camsToCsv } from '@/lib/catalogue/cam-csv';
import { allCams } from '@/lib/db/queries/cams';
import { canSeeCosts } from '@/lib/auth/costs';
import { route } from '@/lib/http/route';

/** The whole cam catalogue as CSV, in the import's columns (costs left out for technicians). */
export const GET = route({ permission: 'catalogue.read' }, async ({ user }) => {
  const csv = camsToCsv(await allCams(), { includeCosts: canSeeCosts(user) });
  const date = new Date().toISOString().slice(0, 10);
  return new Response(`\uFEFF${csv}\r\n`, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="lobewise-cams-${date}.csv"`,
      'Cache-Control': 'no-store',
    },
  });
});
