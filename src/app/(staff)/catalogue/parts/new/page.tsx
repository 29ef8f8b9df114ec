import type { Metadata } from 'next';
import { PartForm } from '@/components/catalogue/part-labor-settings-forms';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { listSuppliers } from '@/lib/db/queries/cams';

export const metadata: Metadata = { title: 'Add a part' };

export default async function NewPartPage() {
  await requireAccessForPage('catalogue.write');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Add a part" back={{ href: '/catalogue/parts', label: 'Parts' }} />
      <PartForm part={null} suppliers={await listSuppliers()} />
    </div>
  );
}
