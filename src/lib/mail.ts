import { Resend } from 'resend';
import { requireEnv } from './env';

// The one place the app sends e-mail. The SDK reads RESEND_BASE_URL itself, so pointing it at the
// local fake (docker-local/mail-fake) or the real service is a change of environment only.
export type OutgoingMail = { to: string | string[]; subject: string; html: string; text: string; replyTo?: string };

let client: Resend | undefined;

function resend(): Resend {
  client ??= new Resend(requireEnv('RESEND_API_KEY'));
  return client;
}

export async function sendMail(mail: OutgoingMail): Promise<{ id: string }> {
  const from = process.env.MAIL_FROM ?? 'Lobewise <no-reply@lobewise.test>';
  const { data, error } = await resend().emails.send({ from, ...mail });
  if (error || !data) throw new Error(`Mail was not accepted: ${error?.message ?? 'no answer from the mail service'}`);
  return { id: data.id };
}
