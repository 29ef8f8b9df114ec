import { quoteExportChunks } from '@/lib/db/queries/quote-export';
import { route } from '@/lib/http/route';
import { quoteCsvHeader, quoteCsvRows } from '@/lib/reports/quotes-csv';
import { ReportRangeSchema } from '@/lib/schemas/report';

/**
 * Quotes created in ?from..to as CSV (formula-like cells neutralised), every one of them: streamed a
 * chunk at a time, so a year of a busy shop neither waits for nor holds the whole file. Managers only.
 */
export const GET = route({ permission: 'reports.read', query: ReportRangeSchema }, async ({ query: range }) => {
  const chunks = quoteExportChunks(range);
  // The first chunk is read before answering: a database that is away fails the request, not the download.
  const first = await chunks.next();
  const encoder = new TextEncoder();
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(encoder.encode(`\uFEFF${quoteCsvHeader()}\r\n${first.done ? '' : quoteCsvRows(first.value)}`));
      if (first.done) controller.close();
    },
    async pull(controller) {
      try {
        const next = await chunks.next();
        if (next.done) controller.close();
        else controller.enqueue(encoder.encode(quoteCsvRows(next.value)));
      } catch (error) {
        // Half a file must not look like a whole one: the download fails instead of ending early.
        console.error('quotes.csv: stopped mid-file:', error instanceof Error ? error.message : error);
        controller.error(error);
      }
    },
    async cancel() {
      await chunks.return(undefined);
    },
  });
  return new Response(body, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="lobewise-quotes-${range.from}-to-${range.to}.csv"`,
      'Cache-Control': 'no-store',
    },
  });
});
