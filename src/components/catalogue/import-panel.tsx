'use client';

import { useState } from 'react';
import { formatMoney } from '@/lib/format';
import { Banner } from '@/components/ui/banner';
import { Button, buttonClass } from '@/components/ui/button';
import { StateTag } from '@/components/ui/state-tag';
import { tableClass, tdClass, thClass } from '@/components/ui/table';

type Report = {
  mode: 'preview' | 'commit';
  fileName: string;
  committed: boolean;
  message?: string;
  rowCount: number;
  ignoredColumns: string[];
  summary: { create: number; update: number; unchanged: number; error: number };
  suppliersToAdd: string[];
  rows: {
    row: number;
    sku: string;
    name: string;
    action: 'create' | 'update' | 'unchanged' | 'error';
    changes: { column: string; field: string; from: unknown; to: unknown }[];
    errors: { column: string; message: string }[];
  }[];
  errors: { row: number; column: string; message: string }[];
};

const MAX_BYTES = 2 * 1024 * 1024;
const TEMPLATE_URL = ['/api', 'cams', 'import', 'template'].join('/');

/** XMLHttpRequest rather than fetch: it reports upload progress, which a large file needs. */
function post(
  file: File,
  mode: 'preview' | 'commit',
  onProgress: (fraction: number) => void,
): Promise<{ status: number; body: Partial<Report> & { message?: string } }> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    const form = new FormData();
    form.set('mode', mode);
    form.set('file', file);
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onload = () => {
      let body = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = { message: `The server answered ${xhr.status}.` };
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => resolve({ status: 0, body: { message: 'The server could not be reached.' } });
    xhr.open('POST', '/api/cams/import');
    xhr.send(form);
  });
}

function cell(field: string, value: unknown) {
  if (value === null || value === undefined || value === '') return '(blank)';
  if (field.endsWith('Cents')) return formatMoney(Number(value));
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return String(value);
}

export function ImportPanel() {
  const [file, setFile] = useState<File | null>(null);
  const [report, setReport] = useState<Report | null>(null);
  const [stage, setStage] = useState<'idle' | 'uploading' | 'checking' | 'done'>('idle');
  const [progress, setProgress] = useState(0);
  const [problem, setProblem] = useState<string | null>(null);
  const [show, setShow] = useState<'all' | 'problems' | 'changes'>('all');

  async function run(mode: 'preview' | 'commit') {
    if (!file) return;
    setProblem(null);
    setStage('uploading');
    setProgress(0);
    const result = await post(file, mode, (f) => {
      setProgress(f);
      if (f >= 1) setStage('checking');
    });
    setStage('done');
    if (result.status === 200 || (result.status === 422 && result.body.rows)) {
      setReport(result.body as Report);
      if (result.status === 422) setProblem(result.body.message ?? 'Nothing was imported.');
    } else {
      setReport(null);
      setProblem(result.body.message ?? `The server answered ${result.status}.`);
    }
  }

  const rows =
    report?.rows.filter(
      (r) =>
        show === 'all' || (show === 'problems' ? r.action === 'error' : r.action === 'create' || r.action === 'update'),
    ) ?? [];
  const shown = rows.slice(0, 500);
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-3 rounded border border-steel-300 bg-paper-raised p-4">
        <label className="flex flex-col gap-1 text-sm font-semibold">
          Supplier spreadsheet (CSV, up to 2 MB)
          <input
            type="file"
            accept=".csv,text/csv"
            className="text-sm font-normal"
            onChange={(e) => {
              const chosen = e.target.files?.[0] ?? null;
              setReport(null);
              setStage('idle');
              setProblem(
                chosen && chosen.size > MAX_BYTES
                  ? `That file is ${(chosen.size / (1024 * 1024)).toFixed(1)} MB; the limit is 2 MB. Split it into smaller files.`
                  : null,
              );
              setFile(chosen && chosen.size <= MAX_BYTES ? chosen : null);
            }}
          />
        </label>
        <div className="flex flex-wrap items-center gap-2">
          <Button
            type="button"
            variant="quiet"
            disabled={!file || stage === 'uploading' || stage === 'checking'}
            onClick={() => run('preview')}
          >
            Check the file (nothing is saved)
          </Button>
          <Button
            type="button"
            variant="primary"
            disabled={
              !file ||
              !report ||
              report.mode !== 'preview' ||
              report.errors.length > 0 ||
              stage === 'uploading' ||
              stage === 'checking'
            }
            onClick={() => run('commit')}
          >
            Import{' '}
            {report && report.mode === 'preview' ? `${report.summary.create + report.summary.update} change(s)` : ''}
          </Button>
          <a href={TEMPLATE_URL} download className="text-sm text-gauge-700 underline">
            Download the template
          </a>
        </div>
        {stage === 'uploading' || stage === 'checking' ? (
          <div aria-live="polite" className="flex flex-col gap-1 text-sm">
            <progress max={1} value={stage === 'checking' ? undefined : progress} className="h-2 w-full" />
            <span>{stage === 'uploading' ? `Uploading… ${Math.round(progress * 100)} %` : 'Checking every row…'}</span>
          </div>
        ) : null}
      </div>

      {problem ? (
        <Banner tone="fault" title="Not imported">
          {problem}
        </Banner>
      ) : null}
      {report?.committed ? (
        <Banner tone="ok" title="Imported">
          {report.message}
        </Banner>
      ) : null}

      {report ? (
        <section aria-labelledby="preview-title" className="flex flex-col gap-2">
          <h2 id="preview-title" className="text-lg font-semibold">
            {report.committed ? 'What was imported' : 'What the import would do'} — {report.fileName}
          </h2>
          <p className="text-sm tabular-nums">
            {report.rowCount} row(s): <strong>{report.summary.create}</strong> new,{' '}
            <strong>{report.summary.update}</strong> updated, {report.summary.unchanged} unchanged,{' '}
            <strong className={report.summary.error ? 'text-fault-700' : ''}>
              {report.summary.error} with problems
            </strong>
            .{report.suppliersToAdd.length ? ` New supplier(s): ${report.suppliersToAdd.join(', ')}.` : ''}
            {report.ignoredColumns.length ? ` Columns not used: ${report.ignoredColumns.join(', ')}.` : ''}
          </p>
          {report.errors
            .filter((e) => e.row <= 1)
            .map((e) => (
              <Banner key={`${e.row}-${e.column}`} tone="fault" title={`Header row, column ${e.column}`}>
                {e.message}
              </Banner>
            ))}
          <div className="flex gap-2 text-sm" role="group" aria-label="Rows to show">
            {(['all', 'problems', 'changes'] as const).map((v) => (
              <button
                key={v}
                type="button"
                aria-pressed={show === v}
                className={buttonClass('quiet', show === v ? 'ring-2 ring-gauge-500' : '')}
                onClick={() => setShow(v)}
              >
                {v === 'all' ? 'All rows' : v === 'problems' ? 'Problems only' : 'Changes only'}
              </button>
            ))}
          </div>
          <div className="overflow-x-auto rounded border border-steel-300 bg-paper-raised">
            <table className={tableClass}>
              <thead>
                <tr>
                  <th className={thClass}>Row</th>
                  <th className={thClass}>SKU</th>
                  <th className={thClass}>Name</th>
                  <th className={thClass}>Result</th>
                  <th className={thClass}>Details</th>
                </tr>
              </thead>
              <tbody>
                {shown.map((r) => (
                  <tr key={r.row}>
                    <td className={`${tdClass} spec`}>{r.row}</td>
                    <td className={`${tdClass} spec`}>{r.sku || '—'}</td>
                    <td className={tdClass}>{r.name}</td>
                    <td className={tdClass}>
                      {r.action === 'create' ? (
                        <StateTag tone="ok">New</StateTag>
                      ) : r.action === 'update' ? (
                        <StateTag tone="caution">Update</StateTag>
                      ) : r.action === 'unchanged' ? (
                        <StateTag tone="muted">Unchanged</StateTag>
                      ) : (
                        <StateTag tone="fault">Problem</StateTag>
                      )}
                    </td>
                    <td className={`${tdClass} text-xs`}>
                      {r.errors.map((e) => (
                        <p key={e.column} className="text-fault-700">
                          <span className="spec font-semibold">{e.column}</span>: {e.message}
                        </p>
                      ))}
                      {r.changes.map((c) => (
                        <p key={c.column}>
                          <span className="spec font-semibold">{c.column}</span>:{' '}
                          <span className="spec">{cell(c.field, c.from)}</span> →{' '}
                          <span className="spec">{cell(c.field, c.to)}</span>
                        </p>
                      ))}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {rows.length > shown.length ? (
              <p className="p-2 text-xs text-ink-muted">
                Showing the first {shown.length} of {rows.length} rows.
              </p>
            ) : null}
            {rows.length === 0 ? <p className="p-3 text-sm text-ink-soft">No rows in this view.</p> : null}
          </div>
        </section>
      ) : null}
    </div>
  );
}
