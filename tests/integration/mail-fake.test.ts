// Drives docker-local/mail-fake through the real `resend` SDK, exactly as the app will,
// so a mismatch between the fake and the SDK's wire format fails here first.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Resend } from 'resend';
import { startFakeProcess, stopFakeProcess, type FakeProcess } from '../support/fake-process';

const API_KEY = 're_test_suite_only';

type Fake = FakeProcess;
type Listed = {
  id: string;
  from: string;
  to: string[];
  subject: string;
  html: string | null;
  text: string | null;
  createdAt: string;
};

const startFake = (dataDir: string) =>
  startFakeProcess('mail-fake', { MAIL_FAKE_PORT: '0', MAIL_FAKE_API_KEY: API_KEY, MAIL_FAKE_DATA_DIR: dataDir });
const stopFake = stopFakeProcess;

async function listMessages(fake: Fake, to?: string): Promise<Listed[]> {
  const response = await fetch(`${fake.baseUrl}/messages${to ? `?to=${encodeURIComponent(to)}` : ''}`);
  expect(response.status).toBe(200);
  return (await response.json()) as Listed[];
}

describe('mail fake via the resend SDK', () => {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'mail-fake-test-'));
  const savedBaseUrl = process.env.RESEND_BASE_URL;
  let fake: Fake;
  let resend: Resend;

  beforeAll(async () => {
    fake = await startFake(dataDir);
    // The app configures the SDK through this variable, so the test does too.
    process.env.RESEND_BASE_URL = fake.baseUrl;
    resend = new Resend(API_KEY);
  });

  afterAll(async () => {
    if (fake) await stopFake(fake);
    if (savedBaseUrl === undefined) delete process.env.RESEND_BASE_URL;
    else process.env.RESEND_BASE_URL = savedBaseUrl;
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  beforeEach(async () => {
    expect((await fetch(`${fake.baseUrl}/messages`, { method: 'DELETE' })).status).toBe(200);
  });

  it('stores sent e-mails and lists them newest first', async () => {
    const first = await resend.emails.send({
      from: 'Quotes <quotes@shop.example.test>',
      to: 'driver@example.test',
      subject: 'Your camshaft quote',
      html: '<p>Quote <b>#101</b></p>',
      text: 'Quote #101',
    });
    const second = await resend.emails.send({
      from: 'quotes@shop.example.test',
      to: ['other@example.test', 'driver@example.test'],
      subject: 'Deposit received',
      text: 'Thanks',
    });
    expect(first.error).toBeNull();
    expect(second.error).toBeNull();

    const listed = await listMessages(fake);
    expect(listed.map((m) => m.id)).toEqual([second.data!.id, first.data!.id]);
    expect(listed[1]).toMatchObject({
      from: 'Quotes <quotes@shop.example.test>',
      to: ['driver@example.test'],
      subject: 'Your camshaft quote',
      html: '<p>Quote <b>#101</b></p>',
      text: 'Quote #101',
    });
    expect(Date.parse(listed[1].createdAt)).not.toBeNaN();
    expect(listed[0].to).toEqual(['other@example.test', 'driver@example.test']);
  });

  it('filters the listing by recipient', async () => {
    await resend.emails.send({ from: 'a@shop.example.test', to: 'one@example.test', subject: 'one', text: '1' });
    await resend.emails.send({
      from: 'a@shop.example.test',
      to: 'Two Person <two@example.test>',
      subject: 'two',
      text: '2',
    });
    expect((await listMessages(fake, 'two@example.test')).map((m) => m.subject)).toEqual(['two']);
    expect(await listMessages(fake, 'nobody@example.test')).toEqual([]);
  });

  it('returns a sent e-mail through emails.get', async () => {
    const sent = await resend.emails.send({
      from: 'a@shop.example.test',
      to: 'x@example.test',
      subject: 'Lookup',
      text: 'hi',
    });
    const fetched = await resend.emails.get(sent.data!.id);
    expect(fetched.error).toBeNull();
    expect(fetched.data).toMatchObject({ id: sent.data!.id, subject: 'Lookup', to: ['x@example.test'] });
  });

  it('sends a batch', async () => {
    const result = await resend.batch.send([
      { from: 'a@shop.example.test', to: 'b1@example.test', subject: 'B1', text: '1' },
      { from: 'a@shop.example.test', to: 'b2@example.test', subject: 'B2', text: '2' },
    ]);
    expect(result.error).toBeNull();
    expect(result.data!.data).toHaveLength(2);
    expect((await listMessages(fake)).map((m) => m.subject)).toEqual(['B2', 'B1']);
  });

  it('rejects a missing subject with a 422 the SDK reports', async () => {
    const result = await resend.emails.send({
      from: 'a@shop.example.test',
      to: 'x@example.test',
      text: 'no subject',
    } as never);
    expect(result.data).toBeNull();
    expect(result.error).toMatchObject({ statusCode: 422, name: 'missing_required_field' });
    expect(await listMessages(fake)).toEqual([]);
  });

  it('rejects a message with neither html nor text', async () => {
    const result = await resend.emails.send({
      from: 'a@shop.example.test',
      to: 'x@example.test',
      subject: 'empty',
    } as never);
    expect(result.error).toMatchObject({ statusCode: 422 });
  });

  it('refuses a wrong API key', async () => {
    const intruder = new Resend('re_wrong_key');
    const result = await intruder.emails.send({
      from: 'a@shop.example.test',
      to: 'x@example.test',
      subject: 's',
      text: 't',
    });
    expect(result.data).toBeNull();
    expect(result.error).toMatchObject({ statusCode: 403, name: 'invalid_api_key' });
    expect(await listMessages(fake)).toEqual([]);
  });

  it('replays an idempotent send instead of storing it twice', async () => {
    const email = { from: 'a@shop.example.test', to: 'x@example.test', subject: 'Once', text: 'only once' };
    const a = await resend.emails.send(email, { idempotencyKey: 'quote-101-mail' });
    const b = await resend.emails.send(email, { idempotencyKey: 'quote-101-mail' });
    expect(b.data!.id).toBe(a.data!.id);
    expect(await listMessages(fake)).toHaveLength(1);
  });

  it('escapes message content on the inbox page and sandboxes the HTML body', async () => {
    const sent = await resend.emails.send({
      from: 'a@shop.example.test',
      to: 'x@example.test',
      subject: '<script>alert(1)</script>',
      html: '<img src=x onerror="alert(2)">',
    });
    const page = await (await fetch(`${fake.baseUrl}/?id=${sent.data!.id}`)).text();
    expect(page).not.toContain('<script>alert(1)</script>');
    expect(page).toContain('&#60;script&#62;alert(1)&#60;/script&#62;');
    expect(page).toMatch(/<iframe sandbox="" srcdoc="&#60;img src=x onerror=&#34;alert\(2\)&#34;&#62;"/);
  });

  it('keeps messages across a restart and shuts down cleanly', async () => {
    const sent = await resend.emails.send({
      from: 'a@shop.example.test',
      to: 'x@example.test',
      subject: 'Survivor',
      text: 'still here',
    });
    expect(await stopFake(fake)).toBe(0);

    fake = await startFake(dataDir);
    process.env.RESEND_BASE_URL = fake.baseUrl;
    resend = new Resend(API_KEY);
    const listed = await listMessages(fake);
    expect(listed.map((m) => m.id)).toEqual([sent.data!.id]);
    expect(listed[0].text).toBe('still here');
    // Atomic writes leave only the final file behind.
    expect(fs.readdirSync(dataDir)).toEqual(['messages.json']);
  });
});
