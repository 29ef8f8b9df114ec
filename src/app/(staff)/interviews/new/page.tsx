import type { Metadata } from 'next';
import { PageHeader } from '@/components/catalogue/ui';
import { InterviewForm } from '@/components/interviews/interview-form';
import { requireRoleForPage } from '@/lib/auth/guard';
import { listBaselineCards } from '@/lib/db/queries/builds';

export const metadata: Metadata = { title: 'New interview' };

export default async function NewInterviewPage() {
  await requireRoleForPage('manager', 'counter');
  const cards = await listBaselineCards();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="New interview" lead="Capture the customer’s whole combination, then rank the shop’s cams for it." back={{ href: '/interviews', label: 'Interviews' }} />
      <InterviewForm mode="create" cards={cards} />
    </div>
  );
}
