import 'server-only';
import { Resend } from 'resend';
import { requireEnv } from './env';

// The one place the app sends e-mail. The SDK reads RESEND_BASE_URL itself, so pointing it at the
// local fake (docker-local/mail-fake) or the real service is a change of environment only.
/** A file sent with a mail (a receipt or invoice PDF); the SDK sends its bytes as base64. */
export type MailAttachment = { filename: string; content: Buffer; contentType?: string };
export type OutgoingMail = {
  to: string | string[];
  subject: string;
  html: string;
  text: string;
  replyTo?: string;
  fromName?: string;
  attachments?: MailAttachment[];
};

/**
 * The mail service refused the message or did not answer. Callers that must not go on without the
 * e-mail (sending a quote, an invitation) test `instanceof MailError`; nobody matches error text.
 */
export class MailError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'MailError';
  }
}

let client: Resend | undefined;

function resend(): Resend {
  client ??= new Resend(requireEnv('RESEND_API_KEY'));
  return client;
}

/**
 * A value that goes into a mail header, on one line. The schemas already refuse line breaks in names and
 * addresses; this is the last guard, so no CR/LF from any caller can ever start a new header.
 */
export function headerValue(value: string): string {
  return value
    .replace(/[\r\n\u2028\u2029]+/g, ' ')
    .replace(/[\u0000-\u001f\u007f]/g, '')
    .trim();
}

/**
 * The sender: MAIL_FROM's address (the one the mail service lets us send from), under the shop's name
 * when one is given. The name is quoted, with the characters that could end the quote or the name left
 * out, so a shop called `Tom "Cams" <x@y>` can never change the address.
 */
export function fromHeader(name?: string): string {
  const configured = headerValue(process.env.MAIL_FROM ?? 'Lobewise <no-reply@lobewise.test>');
  if (!name) return configured;
  const address = /<([^<>\s]+)>\s*$/.exec(configured)?.[1] ?? configured;
  const display = headerValue(name)
    .replace(/["\\<>]/g, '')
    .slice(0, 100)
    .trim();
  return display ? `"${display}" <${address}>` : configured;
}

export async function sendMail(mail: OutgoingMail): Promise<{ id: string }> {
  const { to, subject, replyTo, html, text } = mail;
  const reply = replyTo === undefined ? '' : headerValue(replyTo);
  let answer: Awaited<ReturnType<Resend['emails']['send']>>;
  try {
    answer = await resend().emails.send({
      from: fromHeader(mail.fromName),
      to: Array.isArray(to) ? to.map(headerValue) : headerValue(to),
      subject: headerValue(subject),
      ...(reply ? { replyTo: reply } : {}),
      html,
      text,
      ...(mail.attachments?.length
        ? {
            attachments: mail.attachments.map((a) => ({
              filename: headerValue(a.filename),
              content: a.content,
              contentType: a.contentType ?? 'application/pdf',
            })),
          }
        : {}),
    });
  } catch (cause) {
    // The SDK throws (instead of answering an error) when the service cannot be reached at all.
    throw new MailError(
      `Mail was not sent: ${cause instanceof Error ? cause.message : 'the mail service could not be reached'}`,
      { cause },
    );
  }
  const { data, error } = answer;
  if (error || !data)
    throw new MailError(`Mail was not accepted: ${error?.message ?? 'no answer from the mail service'}`);
  return { id: data.id };
}
