import { NextResponse } from 'next/server';
import { importCamSpreadsheet } from '@/lib/catalogue/cam-import';
import { CSV_MAX_BYTES } from '@/lib/catalogue/csv';
import { route } from '@/lib/http/route';
import { readUpload } from '@/lib/http/uploads';

/**
 * A supplier's cam spreadsheet (CSV, at most 2 MB) in the multipart field `file`, with `mode` preview
 * (check every row, write nothing) or commit (write every row in one transaction, or none when any row
 * has an error). Both answer the same row-by-row report.
 */
export const POST = route({ permission: 'catalogue.write' }, async ({ request, user }) =>
  NextResponse.json(await importCamSpreadsheet(await readUpload(request, CSV_MAX_BYTES, 'cam spreadsheet'), user)),
);
