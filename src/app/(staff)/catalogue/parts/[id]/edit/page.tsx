import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Attachments } from '@/components/catalogue/attachments';
import { PartForm } from '@/components/catalogue/part-labor-settings-forms';
import { DeleteButton } from '@/components/catalogue/rule-form';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { listSuppliers } from '@/lib/db/queries/cams';
import { getPart } from '@/lib/db/queries/parts';

export const metadata: Metadata = { title: 'Edit part' };

export default async function EditPartPage({ params }: { params: Promise<{ id: string }> }) {
  await requireAccessForPage('catalogue.write');
  const { id } = await params;
  const part = /^\d{1,10}$/.test(id) ? await getPart(Number(id)) : null;
  if (!part) notFound();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={`Edit ${part.sku}`}
        back={{ href: '/catalogue/parts', label: 'Parts' }}
        actions={<DeleteButton url={`/api/parts/${part.id}`} label="Delete or switch off" after="/catalogue/parts" />}
      />
      <PartForm part={part} suppliers={await listSuppliers()} />
      <Attachments baseUrl={`/api/parts/${part.id}`} canEdit />
    </div>
  );
}
