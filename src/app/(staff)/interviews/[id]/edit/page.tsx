import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { InterviewForm } from '@/components/interviews/interview-form';
import { requireAccessForPage } from '@/lib/auth/guard';
import { getBuild, listBaselineCards } from '@/lib/db/queries/builds';

export const metadata: Metadata = { title: 'Edit build' };

export default async function EditBuildPage({ params }: { params: Promise<{ id: string }> }) {
  await requireAccessForPage('builds.write');
  const { id } = await params;
  if (!/^\d{1,10}$/.test(id)) notFound();
  const [build, cards] = await Promise.all([getBuild(Number(id)), listBaselineCards()]);
  if (!build) notFound();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={`Edit build: ${build.vehicleLabel}`}
        lead={`${build.customerName} · saved ${build.updatedAt.slice(0, 10)}`}
        back={{ href: '/interviews', label: 'Interviews' }}
      />
      <InterviewForm
        mode="edit"
        cards={cards}
        build={{
          id: build.id,
          version: build.version,
          customerId: build.customerId,
          customerName: build.customerName,
          vehicleLabel: build.vehicleLabel,
          baselineCamId: build.baselineCamId,
          profile: build.profile,
        }}
      />
    </div>
  );
}
