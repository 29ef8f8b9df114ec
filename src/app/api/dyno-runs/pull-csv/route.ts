import { NextResponse } from 'next/server';
import { notCsvReason } from '@/lib/catalogue/csv';
import { checkCurveCsv, CURVE_CSV_MAX_BYTES, problemText } from '@/lib/dyno/curve-csv';
import { HttpError } from '@/lib/http/errors';
import { route } from '@/lib/http/route';
import { readUpload } from '@/lib/http/uploads';

/**
 * POST /api/dyno-runs/pull-csv — a dyno pull's CSV (rpm, torque in lb·ft; docs/dyno.md) in the multipart
 * field `file`. Checks it with the parser the job page uses and answers the points, ready to send as
 * `curve` to POST /api/dyno-runs. Records nothing: the run still needs its air data and phase.
 * 413 past 100 kB, 415 when the file is not CSV text, 422 with every problem by row and column.
 */
export const POST = route({ permission: 'dyno.record' }, async ({ request }) => {
  const { file, bytes } = await readUpload(request, CURVE_CSV_MAX_BYTES, 'pull CSV');
  const notCsv = notCsvReason(bytes, file.name, file.type);
  if (notCsv) throw new HttpError(415, notCsv, { errors: [{ field: 'file', message: 'not a CSV file' }] });
  const { points, lines, problems } = checkCurveCsv(new TextDecoder().decode(bytes));
  if (problems.length)
    throw new HttpError(422, `${file.name} has ${problems.length} problem${problems.length === 1 ? '' : 's'}.`, {
      errors: problems.map((p) => ({ field: 'file', row: p.row, column: p.column, message: problemText(p) })),
    });
  return NextResponse.json({ fileName: file.name, points, rows: lines });
});
