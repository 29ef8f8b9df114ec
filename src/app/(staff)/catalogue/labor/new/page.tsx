import type { Metadata } from 'next';
import { LaborForm } from '@/components/catalogue/part-labor-settings-forms';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Add a labour operation' };

export default async function NewLaborPage() {
  await requireAccessForPage('catalogue.write');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Add a labour operation" back={{ href: '/catalogue/labor', label: 'Labour' }} />
      <LaborForm labor={null} />
    </div>
  );
}
