import { readRuntime } from './runtime';

// Reading what the app sent through the local mail fake. Some mail goes out after the answer (the
// reset link is sent once the 202 has left), so tests wait for it instead of reading at once.
export type Mail = {
  id: string;
  to: string[];
  subject: string;
  html: string;
  text: string;
  reply_to?: string[] | string | null;
};

export async function mailsTo(email: string): Promise<Mail[]> {
  const all = (await (await fetch(`${readRuntime().mailUrl}/messages`)).json()) as Mail[];
  return all.filter((mail) => mail.to.includes(email));
}

/** Newest first, once at least `count` mails to that address have arrived; throws after `timeoutMs`. */
export async function waitForMailsTo(email: string, count = 1, timeoutMs = 10_000): Promise<Mail[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const mails = await mailsTo(email);
    if (mails.length >= count) return mails;
    if (Date.now() > deadline)
      throw new Error(`expected ${count} mail(s) to ${email} within ${timeoutMs} ms, got ${mails.length}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
