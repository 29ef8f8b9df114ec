import { valuesFromBuild, type InterviewValues } from '@/lib/builds/interview-values';
import type { BaselineCardOption } from '@/lib/builds/types';
import type { LeadRecord } from './types';
import { LeadAnswersSchema } from '@/lib/schemas/lead';
import { buildProfileFromAnswers, engineLiters } from './profile';

// "Start an interview" from a lead: the counter form opens with the customer's contact details and the
// same conservative build the questionnaire ranked, for the counter to correct with the real figures.
export function interviewValuesFromLead(lead: LeadRecord, cards: BaselineCardOption[]): InterviewValues | null {
  const answers = LeadAnswersSchema.safeParse(lead.answers);
  if (!answers.success) return null;
  const profile = buildProfileFromAnswers(answers.data, cards);
  if (!profile) return null;
  const liters = engineLiters(answers.data);
  const baselineCamId = Number(profile.baselineCam.id);
  const values = valuesFromBuild(
    {
      customerId: 0,
      customerName: lead.name,
      vehicleLabel: `${liters.toFixed(1)} L${answers.data.engine === 'unsure' ? ' (customer not sure of the engine)' : ''}`,
      baselineCamId: Number.isSafeInteger(baselineCamId) ? baselineCamId : null,
      profile: profile as unknown as Record<string, unknown>,
    },
    cards,
  );
  return {
    ...values,
    customerMode: 'new',
    customerId: '',
    customer: {
      name: lead.name,
      phone: lead.phone ?? '',
      email: lead.email ?? '',
      notes: `From the at-home questionnaire (lead #${lead.id}); the build figures are assumed defaults.`,
    },
  };
}
