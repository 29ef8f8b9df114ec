import type { Metadata } from 'next';
import { Questionnaire } from '@/components/leads/questionnaire';

export const metadata: Metadata = { title: 'Which cam suits your engine?' };

export default function AskPage() {
  return <Questionnaire />;
}
