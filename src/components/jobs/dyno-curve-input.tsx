'use client';

import { useField } from 'formik';
import { useState } from 'react';
import { sendJson } from '@/lib/api-client';
import { CURVE_CSV_MAX_BYTES, CURVE_CSV_TEMPLATE } from '@/lib/dyno/curve-csv';
import { DYNO_LIMITS as L } from '@/lib/schemas/dyno-run';
import { FieldProblem } from './dyno-fields';

// The pull as CSV: pasted into the box or loaded from the dyno software's export file. A loaded file is
// checked by the server (POST /api/dyno-runs/pull-csv, the same parser as the box) and then fills the box,
// so the technician sees what will be sent; the server's row-numbered problems show under the file.
// The name and size are checked here first only to spare a pointless upload; the server checks both again.

const CSV_TYPES = new Set(['text/csv', 'text/plain', 'application/vnd.ms-excel', '']);

function downloadTemplate() {
  const url = URL.createObjectURL(new Blob([CURVE_CSV_TEMPLATE], { type: 'text/csv' }));
  const link = Object.assign(document.createElement('a'), { href: url, download: 'dyno-pull-template.csv' });
  link.click();
  // Revoked a moment later: revoking at once can cancel the download before it starts.
  setTimeout(() => URL.revokeObjectURL(url), 5000);
}

export function CurveInput() {
  const [field, meta, helpers] = useField<string>('curveCsv');
  const [fileProblem, setFileProblem] = useState<string | null>(null);
  const error = meta.touched ? meta.error : undefined;

  async function load(file: File | undefined) {
    setFileProblem(null);
    if (!file) return;
    if (!/\.(csv|txt)$/i.test(file.name) || !CSV_TYPES.has(file.type)) {
      setFileProblem(`${file.name} is not a CSV file: export the pull as .csv (rpm, torque in lb·ft)`);
      return;
    }
    if (file.size > CURVE_CSV_MAX_BYTES) {
      setFileProblem(
        `${file.name} is ${Math.ceil(file.size / 1000)} kB; a pull’s CSV is at most ${CURVE_CSV_MAX_BYTES / 1000} kB`,
      );
      return;
    }
    const form = new FormData();
    form.set('file', file);
    const answer = await sendJson('POST', '/api/dyno-runs/pull-csv', form);
    if (!answer.ok && answer.status !== 422) {
      setFileProblem(answer.body.message ?? `The file was not checked (${answer.status}).`);
      return;
    }
    if (answer.status === 422) {
      const rows = (answer.body.errors ?? []).map((e) => e.message);
      setFileProblem(
        `${file.name}: ${rows.slice(0, 3).join('; ')}${rows.length > 3 ? ` (and ${rows.length - 3} more)` : ''}`,
      );
    }
    // Filled even with problems, so they can be put right in the box.
    const text = await file.text();
    // Touched first without validating: validating there would check the box's old text and could land last.
    await helpers.setTouched(true, false);
    await helpers.setValue(text);
  }

  return (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor="dyno-curveCsv" className="font-semibold">
        Pull points (rpm, torque in lb·ft)
      </label>
      <span id="dyno-curveCsv-hint" className="text-xs text-ink-muted">
        One line per point, a header line is allowed. Power is worked out as lb·ft × rpm ÷ 5252. {L.curvePoints.min}–
        {L.curvePoints.max} points, rpm rising, {L.rpm.min}–{L.rpm.max} rpm, {L.torqueLbFt.min}–{L.torqueLbFt.max}{' '}
        lb·ft.
      </span>
      <textarea
        {...field}
        id="dyno-curveCsv"
        rows={8}
        placeholder={'rpm,torque\n3000,352.4\n3500,371.0'}
        aria-invalid={error ? true : undefined}
        aria-describedby={`dyno-curveCsv-hint${error ? ' dyno-curveCsv-error' : ''}`}
        className={`spec rounded border bg-paper-raised px-2 py-1 ${error ? 'border-fault-700' : 'border-steel-300'}`}
      />
      <FieldProblem id="dyno-curveCsv-error" error={error} />
      <div className="flex flex-wrap items-center gap-3 print:hidden">
        <label htmlFor="dyno-curveFile" className="font-semibold">
          Or load a CSV file
        </label>
        <input
          id="dyno-curveFile"
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          onChange={(e) => void load(e.target.files?.[0])}
          className="text-xs"
        />
        <button type="button" onClick={downloadTemplate} className="text-xs text-gauge-700 underline">
          Download the template (.csv)
        </button>
      </div>
      <FieldProblem id="dyno-curveFile-error" error={fileProblem ?? undefined} />
    </div>
  );
}
