import { render } from '@react-email/render';
import type { ReactElement } from 'react';

// Both parts of every e-mail from one template: the HTML (React escapes every value) and the plain text
// the same render derives from it, so the two never tell different stories.
export async function renderMail(
  subject: string,
  element: ReactElement,
): Promise<{ subject: string; html: string; text: string }> {
  const [html, text] = await Promise.all([render(element), render(element, { plainText: true })]);
  return { subject, html, text };
}
