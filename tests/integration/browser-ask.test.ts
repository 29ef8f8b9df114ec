import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { QueryTypes, type Sequelize } from 'sequelize';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// The at-home questionnaire in a real browser on a phone-sized screen: every question answered by
// keyboard or taps, Back, a reload in the middle that keeps the answers, then the shortlist.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');
const EMAIL = `ask-browser-${crypto.randomBytes(4).toString('hex')}@example.com`;

async function noHorizontalOverflow(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
}

/** Every visible button, radio card, text input and checkbox card on the screen is at least 44 px tall. */
async function touchTargetsAreBig(page: Page) {
  const small = await page.evaluate(() =>
    [
      ...document.querySelectorAll(
        'main button, main label:has(input[type=radio]), main label:has(input[type=checkbox]), main input[type=text], main input[type=email], main input[type=tel]',
      ),
    ]
      .map((el) => ({
        text: (el.textContent ?? (el as HTMLInputElement).name).trim().slice(0, 40),
        height: el.getBoundingClientRect().height,
      }))
      .filter((t) => t.height > 0 && t.height < 44),
  );
  expect(small).toEqual([]);
}

describe('the questionnaire on a phone', () => {
  let browser: Browser;
  let sequelize: Sequelize;

  beforeAll(async () => {
    sequelize = connectTestDatabase();
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
    const ids = (
      await sequelize.query<{ id: number }>('SELECT id FROM leads WHERE email = ?', {
        replacements: [EMAIL],
        type: QueryTypes.SELECT,
      })
    ).map((r) => r.id);
    if (ids.length) {
      await sequelize.query("DELETE FROM audit_log WHERE entity_type = 'lead' AND entity_id IN (?)", {
        replacements: [ids.map(String)],
      });
      await sequelize.query('DELETE FROM leads WHERE id IN (?)', { replacements: [ids] });
    }
    await disconnectTestDatabase();
  });

  it('answers every question by keyboard and taps and reaches the indicative shortlist', async () => {
    const page = await browser.newPage({ viewport: { width: 375, height: 740 }, hasTouch: true, isMobile: true });
    const consoleErrors: string[] = [];
    page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));

    // From the landing page's link.
    await page.goto(`${appUrl}/`, { waitUntil: 'load' });
    await Promise.all([
      page.waitForURL(/\/ask$/),
      page.getByRole('link', { name: 'Not sure which cam? Answer a few questions' }).click(),
    ]);
    await page.evaluate(() => window.sessionStorage.clear());
    await page.reload();

    const progress = page.getByText(/^Question \d+ of 10$/);
    const heading = page.getByRole('heading', { level: 1 });
    const next = page.getByRole('button', { name: 'Next' });

    // 1. Engine: by keyboard (Tab onto the first choice, arrow down to 5.3, Enter goes on).
    await expect(progress.textContent()).resolves.toBe('Question 1 of 10');
    await expect(heading.textContent()).resolves.toBe('Which engine is it?');
    await noHorizontalOverflow(page);
    await expectNoSeriousA11yViolations(page);
    await touchTargetsAreBig(page);
    await page.screenshot({ path: path.join(SHOTS, 'ask-phone-first.png'), fullPage: true });
    // Going on without an answer says what is missing.
    await next.tap();
    await expect(page.locator('main').getByRole('alert').textContent()).resolves.toMatch(/Pick one of the answers/);
    await expectNoSeriousA11yViolations(page);
    await page.getByRole('radio', { name: /4\.8 litre/ }).focus();
    await page.keyboard.press('ArrowDown');
    await expect(page.getByRole('radio', { name: /5\.3 litre/ }).isChecked()).resolves.toBe(true);
    await page.keyboard.press('Enter');

    // 2–9 by taps on the answer cards.
    const taps: [RegExp, RegExp][] = [
      [/kind of vehicle/, /Pickup truck/],
      [/mostly use it for/, /Towing or hauling/],
      [/sound when it is standing still/, /A little lope you can hear/],
      [/emissions test/, /^No$/],
      [/Automatic or manual/, /Automatic/],
      [/converter or gears/, /No, both as they came/],
      [/exhaust/, /^Stock/],
      [/spend/, /\$1,500 to \$3,000/],
    ];
    for (const [index, [title, answer]] of taps.entries()) {
      await expect(progress.textContent()).resolves.toBe(`Question ${index + 2} of 10`);
      await expect(heading.textContent()).resolves.toMatch(title);
      await page.locator('label').filter({ hasText: answer }).first().tap();
      await touchTargetsAreBig(page);
      await noHorizontalOverflow(page);
      if (index === 3) {
        // Back keeps the earlier answer; a reload keeps everything.
        await page.getByRole('button', { name: 'Back' }).tap();
        await expect(page.getByRole('radio', { name: /A little lope/ }).isChecked()).resolves.toBe(true);
        await next.tap();
        await page.reload();
        // The server renders question 1; the saved place comes back once the page is live.
        await page.getByText('Question 5 of 10').waitFor();
        await expect(progress.textContent()).resolves.toBe('Question 5 of 10');
        await expect(page.getByRole('radio', { name: /^No$/ }).isChecked()).resolves.toBe(true);
      }
      await next.tap();
    }

    // 10. Contact, typed, consent ticked with the space bar, sent with Enter.
    await expect(progress.textContent()).resolves.toBe('Question 10 of 10');
    await page.getByLabel('Your name').fill('Pim Ardengast');
    await page.getByLabel('E-mail').fill(EMAIL);
    await touchTargetsAreBig(page);
    await page.getByRole('checkbox').focus();
    await page.keyboard.press('Space');
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'ask-phone-contact.png'), fullPage: true });
    await Promise.all([page.waitForURL(/\/ask\/result\/[A-Za-z0-9_-]{43}$/), page.getByLabel('E-mail').press('Enter')]);

    await expect(heading.textContent()).resolves.toBe('Your indicative shortlist');
    await expect(page.getByRole('heading', { name: 'This is an estimate, not a quote' }).isVisible()).resolves.toBe(
      true,
    );
    await expect(page.getByRole('heading', { name: 'The shop will contact you' }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('heading', { level: 3, name: /^Choice [123]: / }).count()).resolves.toBe(3);
    // Each choice shows the whole job's price before tax — the number the shop's shortlist and quote show
    // for the same build — and no other figure.
    const text = (await page.locator('main').textContent()) ?? '';
    const prices =
      text.match(
        /About \$[\d,]+\.\d\d for the whole job — the cam, the parts it needs, fitting and the tune — before tax/g,
      ) ?? [];
    expect(prices).toHaveLength(3);
    expect(text.match(/\$[\d,]+(\.\d\d)?/g)).toHaveLength(3);
    await noHorizontalOverflow(page);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'ask-phone-result.png'), fullPage: true });
    // Sent answers are no longer kept in the tab.
    await expect(page.evaluate(() => window.sessionStorage.getItem('lobewise.ask.v2'))).resolves.toBeNull();
    const [row] = await sequelize.query<{ name: string; answers: string | object; shortlist: string | object }>(
      'SELECT name, answers, shortlist FROM leads WHERE email = ?',
      { replacements: [EMAIL], type: QueryTypes.SELECT },
    );
    expect(row.name).toBe('Pim Ardengast');
    const json = (v: string | object) => (typeof v === 'string' ? JSON.parse(v) : v);
    expect(json(row.answers)).toMatchObject({ vehicle: 'truck' });
    // The prices on the page are the stored job prices, to the cent.
    const stored = (json(row.shortlist) as { entries: { jobPriceCents: number }[] }).entries.map(
      (e) => e.jobPriceCents,
    );
    expect(prices.map((p) => p.match(/\$([\d,]+\.\d\d)/)![1])).toEqual(
      stored.map((c) => (c / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })),
    );
    expect(consoleErrors).toEqual([]);
    await page.close();
  });
});
