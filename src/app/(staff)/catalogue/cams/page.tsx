import type { Metadata } from 'next';
import { Suspense } from 'react';
import { CamList } from '@/components/catalogue/cam-list';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { can } from '@/lib/auth/policy';
import { listSuppliers } from '@/lib/db/queries/cams';

export const metadata: Metadata = { title: 'Cams' };

export default async function CamsPage() {
  const user = await requireAccessForPage('catalogue.read');
  const suppliers = await listSuppliers();
  const manager = can(user, 'catalogue.write');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Cams"
        lead="Search and filter the grinds the shop sells; open one for its card, valve events and spec sheets."
        back={{ href: '/catalogue', label: 'Catalogue' }}
        actions={
          <>
            <a
              href="/api/cams/export"
              download
              className="rounded bg-paper-raised px-3 py-1.5 text-sm font-semibold text-ink ring-1 ring-steel-300 hover:ring-gauge-500"
            >
              Export CSV
            </a>
            {manager ? <ButtonLink href="/catalogue/cams/import">Import CSV</ButtonLink> : null}
            {manager ? (
              <ButtonLink href="/catalogue/cams/new" variant="primary">
                Add a cam
              </ButtonLink>
            ) : null}
          </>
        }
      />
      <Suspense fallback={<p className="text-sm text-ink-soft">Loading cams…</p>}>
        <CamList suppliers={suppliers} canEdit={manager} />
      </Suspense>
    </div>
  );
}
