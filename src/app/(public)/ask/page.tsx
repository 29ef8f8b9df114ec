import type { Metadata } from 'next';
import { QuestionnaireLoader } from '@/components/leads/questionnaire-loader';

export const metadata: Metadata = { title: 'Which cam suits your engine?' };

export default function AskPage() {
  return <QuestionnaireLoader />;
}
