import { MailError, sendMail } from '@/lib/mail';
import { adoptRuntimeEnv } from '../support/runtime';

describe('the app mail module', () => {
  it('sends through the official SDK and the message lands in the local mail fake', async () => {
    const { mailUrl } = adoptRuntimeEnv();
    const subject = `Your quote is ready ${Date.now()}`;
    const { id } = await sendMail({ to: 'mail.module.test@example.com', subject, html: '<p>Hello</p>', text: 'Hello' });
    expect(id).toBeTruthy();
    const messages = (await (await fetch(`${mailUrl}/messages`)).json()) as {
      id: string;
      to: string[];
      subject: string;
    }[];
    const found = messages.find((m) => m.id === id);
    expect(found).toBeDefined();
    expect(found!.subject).toBe(subject);
    expect(found!.to).toEqual(['mail.module.test@example.com']);
  });

  it('throws a MailError, which callers test with instanceof, when the mail service refuses the message', async () => {
    const { mailUrl } = adoptRuntimeEnv();
    const subject = `Refused on purpose ${Date.now()}`;
    // The fake, like the real service, refuses a message with neither an HTML nor a text part (422).
    const refused = await sendMail({ to: 'mail.module.refused@example.com', subject, html: '', text: '' }).then(
      () => null,
      (error: unknown) => error,
    );
    expect(refused).toBeInstanceOf(MailError);
    expect((refused as MailError).message).toMatch(/^Mail was not accepted: /);
    const messages = (await (await fetch(`${mailUrl}/messages`)).json()) as { subject: string }[];
    expect(messages.some((m) => m.subject === subject)).toBe(false);
  });
});
