'use client';

import dynamic from 'next/dynamic';

// The questionnaire reads sessionStorage as it starts, so it renders in the browser only.
export const QuestionnaireLoader = dynamic(() => import('./questionnaire').then((m) => m.Questionnaire), {
  ssr: false,
  loading: () => <p className="mx-auto max-w-xl px-4 py-8 text-lg text-ink-soft">Loading the questions…</p>,
});
