import { camTemplateCsv } from '@/lib/catalogue/cam-csv';
import { route } from '@/lib/http/route';

/** The cam spreadsheet template: the header row and one example row. */
export const GET = route(
  { permission: 'catalogue.read' },
  () =>
    new Response(`${camTemplateCsv()}\r\n`, {
      headers: {
        'Content-Type': 'text/csv; charset=utf-8',
        'Content-Disposition': 'attachment; filename="lobewise-cams-template.csv"',
        'Cache-Control': 'no-store',
      },
    }),
);
