import type { SessionUser } from '@/lib/auth/roles';
import { HttpError } from '@/lib/http/errors';
import { invalidFields } from '@/lib/http/responses';
import type { Upload } from '@/lib/http/uploads';
import { commitCams, previewCamImport, type ImportReport } from './cam-csv';
import { notCsvReason } from './csv';

// One cam spreadsheet upload, start to finish: `mode` preview checks every row and writes nothing;
// commit writes every row in one transaction, or none when any row has an error. Both answer the same
// row-by-row report; a refused commit throws it inside an HttpError (422 row errors, 409 a lost race).

export type CamImportAnswer = ImportReport & {
  mode: 'preview' | 'commit';
  fileName: string;
  committed: boolean;
  result?: { created: number; updated: number; unchanged: number; suppliersAdded: string[] };
  message?: string;
};

export async function importCamSpreadsheet({ file, bytes, form }: Upload, user: SessionUser): Promise<CamImportAnswer> {
  const mode = String(form.get('mode') ?? 'preview');
  if (mode !== 'preview' && mode !== 'commit')
    throw invalidFields([{ field: 'mode', message: 'mode must be preview or commit' }]);
  const notCsv = notCsvReason(bytes, file.name, file.type);
  if (notCsv) throw new HttpError(415, notCsv, { errors: [{ field: 'file', message: 'not a CSV file' }] });

  const { report, plan } = await previewCamImport(new TextDecoder('utf-8').decode(bytes));
  const answer: CamImportAnswer = { mode, fileName: file.name, committed: false, ...report };
  if (mode === 'preview') return answer;
  if (report.errors.length)
    throw new HttpError(
      422,
      `Nothing was imported: ${report.errors.length} problem(s) in the file. Fix them and try again.`,
      answer,
    );

  const outcome = await commitCams(plan, user);
  if (outcome.ok) {
    const { created, updated, unchanged } = outcome.record;
    return {
      ...answer,
      committed: true,
      result: outcome.record,
      message: `Imported: ${created} added, ${updated} updated, ${unchanged} unchanged.`,
    };
  }
  if (outcome.reason === 'invalid') {
    const errors = outcome.errors.map((e) => ({ row: 0, column: e.field, field: e.field, message: e.message }));
    throw new HttpError(422, `Nothing was imported: ${outcome.errors.map((e) => e.message).join('; ')}`, {
      ...answer,
      errors,
    });
  }
  throw new HttpError(409, 'Nothing was imported: The import could not be written; nothing was changed.', answer);
}
