import type { Metadata } from 'next';
import { ImportPanel } from '@/components/catalogue/import-panel';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { CAM_CSV_COLUMNS } from '@/lib/catalogue/cam-csv';

export const metadata: Metadata = { title: 'Import cams' };

export default async function ImportCamsPage() {
  await requireAccessForPage('catalogue.write');
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Import a cam spreadsheet"
        lead="Check the file first: you see every row that would be added or changed, and every problem with its row and column. The import writes all rows or none."
        back={{ href: '/catalogue/cams', label: 'Cams' }}
      />
      <ImportPanel />
      <details className="rounded border border-steel-300 bg-paper-raised p-3 text-sm">
        <summary className="cursor-pointer font-semibold">Columns the import reads</summary>
        <table className="mt-2 w-full text-left">
          <thead>
            <tr className="text-xs uppercase text-ink-muted">
              <th className="py-1">Column</th>
              <th>Needed</th>
              <th>Meaning</th>
            </tr>
          </thead>
          <tbody>
            {CAM_CSV_COLUMNS.map((c) => (
              <tr key={c.name} className="border-t border-steel-100">
                <td className="spec py-1">{c.name}</td>
                <td>{c.required ? 'yes' : 'no'}</td>
                <td>{c.help}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </div>
  );
}
