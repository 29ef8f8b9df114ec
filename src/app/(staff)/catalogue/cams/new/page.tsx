import type { Metadata } from 'next';
import { CamForm } from '@/components/catalogue/cam-form';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { listSuppliers } from '@/lib/db/queries/cams';

export const metadata: Metadata = { title: 'Add a cam' };

export default async function NewCamPage() {
  await requireAccessForPage('catalogue.write');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Add a cam"
        lead="Copy the figures from the supplier's cam card; units are shown beside each field."
        back={{ href: '/catalogue/cams', label: 'Cams' }}
      />
      <CamForm cam={null} suppliers={await listSuppliers()} />
    </div>
  );
}
