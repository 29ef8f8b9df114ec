import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { InterviewForm } from '@/components/interviews/interview-form';
import { requireAccessForPage } from '@/lib/auth/guard';
import { listBaselineCards } from '@/lib/db/queries/builds';
import { getLead } from '@/lib/db/queries/leads';
import { interviewValuesFromLead } from '@/lib/leads/prefill';

export const metadata: Metadata = { title: 'New interview' };

export default async function NewInterviewPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  await requireAccessForPage('builds.write');
  const cards = await listBaselineCards();
  // ?lead=<id>: open with the questionnaire's answers (leads page, "Start an interview").
  const leadId = Number((await searchParams).lead);
  const lead = Number.isSafeInteger(leadId) && leadId > 0 ? await getLead(leadId) : null;
  const prefill = lead ? interviewValuesFromLead(lead, cards) : null;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="New interview"
        lead={
          prefill
            ? `Started from ${lead!.name}’s questionnaire answers: the figures are assumed defaults, so check each one with the customer.`
            : 'Capture the customer’s whole combination, then rank the shop’s cams for it.'
        }
        back={{ href: '/interviews', label: 'Interviews' }}
      />
      <InterviewForm mode="create" cards={cards} prefill={prefill} leadId={prefill ? lead!.id : undefined} />
    </div>
  );
}
