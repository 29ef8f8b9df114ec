import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { signedInAgent } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { waitForMailsTo, type Mail } from '../support/mail';
import { pdfText } from '../support/pdf-text';
import { makeSentQuote, payDeposit } from '../support/quote-fixtures';
import { readRuntime } from '../support/runtime';
import { postRefund } from '../support/refunds';
import { MISSING_ID } from '../support/demo';

// Documents and e-mails (issue 12, items 6 and 5): the quote as a PDF for staff and for the customer,
// the customer page's print styles, and every customer e-mail from its template with both parts, from
// the shop's name and answering to the shop's address.
const { appUrl, mailUrl, env } = readRuntime();

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let sequelize: Sequelize;
let counter: Agent;
let manager: Agent;
let tech: Agent;
let shop: { name: string; email: string };

beforeAll(async () => {
  sequelize = connectTestDatabase();
  [counter, manager, tech] = await Promise.all([
    signedInAgent('counter'),
    signedInAgent('manager'),
    signedInAgent('tech'),
  ]);
  [shop] = await sequelize.query<{ name: string; email: string }>(
    'SELECT name, email FROM shop_settings ORDER BY id LIMIT 1',
    { type: QueryTypes.SELECT },
  );
});
afterAll(() => disconnectTestDatabase());

const usd = (cents: number) => (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });

/** supertest keeps a binary answer as a Buffer only when asked to. */
const binary = (res: request.Response, callback: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

describe('the quote as a PDF', () => {
  it('staff download it: a real PDF whose text holds the number, the total, the deposit, the policy and the cautions', async () => {
    const quote = await makeSentQuote(counter, 'Pdf staff');
    const res = await tech.get(`/api/quotes/${quote.id}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe(`attachment; filename="quote-${quote.number}.pdf"`);
    expect(res.headers['cache-control']).toContain('no-store');
    const bytes = res.body as Buffer;
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = pdfText(bytes);
    expect(text).toContain(`Quote ${quote.number}`);
    expect(text).toContain(usd(quote.totalCents));
    expect(text).toContain(usd(quote.depositCents));
    expect(text).toContain(shop.name);
    expect(text).toMatch(/Valid until/);
    expect(text).toMatch(/Deposit and refund policy/);
    expect(text).toMatch(/Local codes and licensed practice come first/);
    expect(text).not.toMatch(/margin|unit cost|goods cost/i);
    expect((await request(appUrl).get(`/api/quotes/${quote.id}/pdf`)).status).toBe(401);
    expect((await manager.get(`/api/quotes/${MISSING_ID}/pdf`)).status).toBe(404);
  });

  it('the customer downloads it from the private link; any other token is a plain 404', async () => {
    const quote = await makeSentQuote(counter, 'Pdf customer');
    const res = await request(appUrl).get(`/api/q/${quote.token}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect((res.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = pdfText(res.body as Buffer);
    expect(text).toContain(quote.number);
    expect(text).toContain(usd(quote.totalCents));
    expect((await request(appUrl).get('/api/q/not-a-live-link-0123456789abcdef/pdf')).status).toBe(404);
  });
});

describe('the customer page on paper', () => {
  it('links the PDF and ships print styles that hide the site header (sign-in) and footer', async () => {
    const quote = await makeSentQuote(counter, 'Print page');
    const page = await request(appUrl).get(`/q/${quote.token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain(`/api/q/${quote.token}/pdf`);
    const sheets = [...page.text.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map((m) => m[1]);
    expect(sheets.length).toBeGreaterThan(0);
    const css = (await Promise.all(sheets.map(async (href) => (await request(appUrl).get(href)).text))).join('\n');
    // Minified or not: an @media print block whose first rule hides the header and the footer.
    expect(css).toMatch(/@media print\s*\{[^@]*?body\s*>\s*header\s*,\s*body\s*>\s*footer[^{]*\{\s*display:\s*none/);
  });
});

async function fullMail(mail: Mail): Promise<{ from: string; reply_to: string[] }> {
  return (await request(mailUrl).get(`/emails/${mail.id}`).set('Authorization', `Bearer ${env.RESEND_API_KEY}`))
    .body as { from: string; reply_to: string[] };
}

describe('e-mails from templates', () => {
  it('quote sent: HTML and text, escaped, from the shop by name, replies to the shop', async () => {
    const quote = await makeSentQuote(counter, 'Mail template', { customerName: 'Dana <b>Ironside</b> & "Sons"' });
    const [mail] = await waitForMailsTo(quote.customerEmail);
    expect(mail.subject).toBe(`Your quote ${quote.number} from ${shop.name}`);
    expect(mail.html).toMatch(/<html/i);
    expect(mail.html).toContain('Dana &lt;b&gt;Ironside&lt;/b&gt; &amp; ');
    expect(mail.html).not.toContain('<b>Ironside</b>');
    expect(mail.text).toContain('Dana <b>Ironside</b> & "Sons"');
    expect(mail.text).not.toMatch(/<(p|div|table)\b/);
    for (const part of [mail.html, mail.text]) {
      expect(part).toContain(usd(quote.totalCents));
      expect(part).toContain(`/q/${quote.token}`);
    }
    const full = await fullMail(mail);
    expect(full.from).toMatch(new RegExp(`^"${shop.name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}" <[^<>]+@[^<>]+>$`));
    expect(full.reply_to).toEqual([shop.email]);
  });

  it('deposit receipt: amount, date and what happens next, both parts', async () => {
    const quote = await makeSentQuote(counter, 'Receipt mail');
    await payDeposit(manager, quote);
    const mails = await waitForMailsTo(quote.customerEmail, 2);
    const receipt = mails.find((m) => m.subject.startsWith('Deposit received'))!;
    expect(receipt.subject).toBe(`Deposit received for quote ${quote.number} — ${shop.name}`);
    for (const part of [receipt.html, receipt.text]) {
      expect(part).toContain(usd(quote.depositCents));
      expect(part).toContain(usd(quote.totalCents - quote.depositCents));
      expect(part).toMatch(/What happens next/);
    }
    expect((await fullMail(receipt)).reply_to).toEqual([shop.email]);
  });

  it('refund notice: after a full refund, both parts, from the shop', async () => {
    const quote = await makeSentQuote(counter, 'Refund mail');
    await payDeposit(manager, quote);
    expect((await postRefund(manager, quote.id, { amountCents: quote.depositCents })).status).toBe(200);
    const mails = await waitForMailsTo(quote.customerEmail, 3);
    const notice = mails.find((m) => /refunded/.test(m.subject))!;
    for (const part of [notice.html, notice.text]) {
      expect(part).toContain(usd(quote.depositCents));
      expect(part).toMatch(/cancelled/);
    }
    expect(notice.html).toMatch(/<html/i);
    expect((await fullMail(notice)).from).toContain(shop.name);
  });
});
