import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { CamForm } from '@/components/catalogue/cam-form';
import { DeleteButton } from '@/components/catalogue/rule-form';
import { PageHeader } from '@/components/ui/page-header';
import { requireAccessForPage } from '@/lib/auth/guard';
import { getCam, listSuppliers } from '@/lib/db/queries/cams';

export const metadata: Metadata = { title: 'Edit cam' };

export default async function EditCamPage({ params }: { params: Promise<{ id: string }> }) {
  await requireAccessForPage('catalogue.write');
  const { id } = await params;
  const cam = /^\d{1,10}$/.test(id) ? await getCam(Number(id)) : null;
  if (!cam) notFound();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={`Edit ${cam.sku}`}
        lead="If someone else saves this cam first, you will see what they changed before anything is overwritten."
        back={{ href: `/catalogue/cams/${cam.id}`, label: cam.name }}
        actions={
          <DeleteButton
            url={`/api/cams/${cam.id}`}
            label={cam.archivedAt ? 'Delete or keep archived' : 'Archive or delete'}
            after="/catalogue/cams"
          />
        }
      />
      <p className="text-xs text-ink-muted">
        Archive or delete: a cam that any quote, build or dyno run refers to is archived (kept, hidden from the
        advisor); one nothing refers to is deleted.
      </p>
      <CamForm cam={cam} suppliers={await listSuppliers()} />
    </div>
  );
}
