import type { Shortlist } from './shortlist';
import { answersInWords } from './questions';
import type { LeadAnswers } from '@/lib/schemas/lead';

// The note to the shop that a questionnaire lead arrived: who, how to reach them, what they answered
// and the shortlist they saw. No link to the customer's private result (that stays theirs).
const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function newLeadEmail({
  leadId,
  answers,
  shortlist,
  leadsUrl,
}: {
  leadId: number;
  answers: LeadAnswers;
  shortlist: Shortlist;
  leadsUrl: string;
}): { subject: string; text: string; html: string } {
  const subject = `New questionnaire lead #${leadId}: ${answers.name}`;
  const contact = [answers.email && `e-mail ${answers.email}`, answers.phone && `phone ${answers.phone}`]
    .filter(Boolean)
    .join(', ');
  const words = answersInWords(answers);
  const cams = shortlist.entries.map((e) => `${e.rank}. ${e.camName}`);
  const text = [
    `${answers.name} answered the questionnaire and agreed to be contacted (${contact}).`,
    '',
    ...words.map((w) => `${w.question} ${w.answer}`),
    '',
    'The indicative shortlist they saw:',
    ...cams,
    '',
    `Open the leads page: ${leadsUrl}`,
  ].join('\n');
  const html = `<p><strong>${escape(answers.name)}</strong> answered the questionnaire and agreed to be contacted (${escape(contact)}).</p>
<ul>${words.map((w) => `<li>${escape(w.question)} <strong>${escape(w.answer)}</strong></li>`).join('')}</ul>
<p>The indicative shortlist they saw:</p><ol>${shortlist.entries.map((e) => `<li>${escape(e.camName)}</li>`).join('')}</ol>
<p><a href="${escape(leadsUrl)}">Open the leads page</a></p>`;
  return { subject, text, html };
}
