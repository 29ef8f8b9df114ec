import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Attachments } from '@/components/catalogue/attachments';
import { LaborForm } from '@/components/catalogue/part-labor-settings-forms';
import { DeleteButton } from '@/components/catalogue/rule-form';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { getLabor } from '@/lib/db/queries/labor';

export const metadata: Metadata = { title: 'Edit labour operation' };

export default async function EditLaborPage({ params }: { params: Promise<{ id: string }> }) {
  await requireAccessForPage('catalogue.write');
  const { id } = await params;
  const labor = /^\d{1,10}$/.test(id) ? await getLabor(Number(id)) : null;
  if (!labor) notFound();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={`Edit ${labor.code}`}
        back={{ href: '/catalogue/labor', label: 'Labour' }}
        actions={<DeleteButton url={`/api/labor/${labor.id}`} label="Delete or switch off" after="/catalogue/labor" />}
      />
      <LaborForm labor={labor} />
      <Attachments baseUrl={`/api/labor/${labor.id}`} canEdit />
    </div>
  );
}
