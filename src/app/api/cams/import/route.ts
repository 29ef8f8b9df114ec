import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { commitCams, previewCamImport } from '@/lib/catalogue/cam-csv';
import { CSV_MAX_BYTES, notCsvReason } from '@/lib/catalogue/csv';
import { readUpload } from '@/lib/http/uploads';
import { errorResponse, validationFailed } from '@/lib/http/responses';

export const dynamic = 'force-dynamic';

/**
 * A supplier's cam spreadsheet (CSV, at most 2 MB) in the multipart field `file`, with `mode` preview
 * (check every row, write nothing) or commit (write every row in one transaction, or none when any row
 * has an error). Both answer the same row-by-row report.
 */
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const read = await readUpload(request, CSV_MAX_BYTES, 'cam spreadsheet');
  if (!read.ok) return read.response;
  const { file, bytes, form } = read.upload;
  const mode = String(form.get('mode') ?? 'preview');
  if (mode !== 'preview' && mode !== 'commit') return validationFailed([{ field: 'mode', message: 'mode must be preview or commit' }]);
  const notCsv = notCsvReason(bytes, file.name, file.type);
  if (notCsv) return errorResponse(415, notCsv, { errors: [{ field: 'file', message: 'not a CSV file' }] });

  const { report, plan } = await previewCamImport(new TextDecoder('utf-8').decode(bytes));
  const body = { mode, fileName: file.name, committed: false, ...report };
  if (mode === 'preview') return NextResponse.json(body);
  if (report.errors.length) {
    return NextResponse.json({ ...body, message: `Nothing was imported: ${report.errors.length} problem(s) in the file. Fix them and try again.` }, { status: 422 });
  }
  const outcome = await commitCams(plan, user);
  if (!outcome.ok) {
    const message = outcome.reason === 'invalid' ? outcome.errors.map((e) => e.message).join('; ') : 'The import could not be written; nothing was changed.';
    return NextResponse.json({ ...body, message: `Nothing was imported: ${message}`, errors: outcome.reason === 'invalid' ? outcome.errors.map((e) => ({ row: 0, column: e.field, field: e.field, message: e.message })) : body.errors }, { status: outcome.reason === 'invalid' ? 422 : 409 });
  }
  return NextResponse.json({ ...body, committed: true, result: outcome.record, message: `Imported: ${outcome.record.created} added, ${outcome.record.updated} updated, ${outcome.record.unchanged} unchanged.` });
}
