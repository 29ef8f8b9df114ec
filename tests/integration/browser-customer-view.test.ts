import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Locator, Page } from 'playwright-core';
import { QueryTypes, type Sequelize } from 'sequelize';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { DEMO, DEMO_KEYS } from '../support/demo';
import { pdfText } from '../support/pdf-text';
import { readRuntime } from '../support/runtime';

// The shortlist turned to the customer (issue 9, item 5): the counter person picks two or three cams on the
// staff shortlist, compares them side by side and turns the screen round. The figures are the cam cards' as
// stored, the price is the one the staff table shows for the same cam, and nothing the shop keeps to itself
// (costs, SKUs, labour codes, scores, stock) reaches the customer's screen or its printout.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

type CamRow = {
  sku: string;
  name: string;
  cost_cents: number;
  intake_duration_050: number;
  exhaust_duration_050: number;
  intake_lift_in: number;
  exhaust_lift_in: number;
  lsa: number;
  intake_centerline: number;
};
type StaffRow = { cardName: string; jobPrice: string };

const degree = (n: number) => `${Number.isInteger(Number(n)) ? Number(n) : Number(n).toFixed(1)}°`;
const money = (cents: number) => (cents / 100).toLocaleString('en-US', { style: 'currency', currency: 'USD' });
/** Every code the shop keeps for itself: cam and part SKUs and labour codes (a customer never needs them). */
const SHOP_CODES = [
  ...Object.values(DEMO_KEYS.cams),
  ...Object.values(DEMO_KEYS.parts),
  ...Object.values(DEMO_KEYS.labor),
];

async function openShortlist(browser: Browser, width: number): Promise<Page> {
  const context = await staffContext(browser, 'counter', { width, height: 900 });
  const page = await context.newPage();
  await page.goto(`${appUrl}/advisor?build=${DEMO.builds.whitlockTowingTruck}`);
  await ranked(page).locator('tbody tr').first().waitFor();
  return page;
}

const ranked = (page: Page) => page.getByRole('table', { name: 'Cams ranked for this build' });

async function staffRows(page: Page): Promise<StaffRow[]> {
  const rows = ranked(page).locator('tbody tr:has([data-job-price])');
  const out: StaffRow[] = [];
  for (let i = 0; i < (await rows.count()); i++) {
    const row = rows.nth(i);
    out.push({
      cardName: ((await row.getByRole('button').first().textContent()) ?? '').trim(),
      jobPrice: ((await row.locator('[data-job-price]').textContent()) ?? '').trim(),
    });
  }
  return out;
}

const chartBox = (page: Page, cardName: string) =>
  page.getByRole('checkbox', { name: `Show ${cardName} on the chart` });

async function pressOn(locator: Locator, key: string): Promise<void> {
  await locator.focus();
  await locator.press(key);
}

/** Nothing wider than the screen: the page itself does not scroll sideways, nor does the customer view. */
async function expectNoSidewaysScroll(page: Page): Promise<void> {
  const widths = await page.evaluate(() => {
    const dialog = document.querySelector('dialog[open]');
    return {
      page: document.documentElement.scrollWidth,
      screen: window.innerWidth,
      dialog: dialog ? dialog.scrollWidth - dialog.clientWidth : 0,
    };
  });
  expect(widths.page).toBeLessThanOrEqual(widths.screen);
  expect(widths.dialog).toBeLessThanOrEqual(0);
}

describe('the shortlist turned to the customer', () => {
  let browser: Browser;
  let sequelize: Sequelize;
  beforeAll(async () => {
    sequelize = connectTestDatabase();
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
    await disconnectTestDatabase();
  });

  const camsByCardName = async (cardNames: string[]) => {
    const rows = await sequelize.query<CamRow>(
      `SELECT sku, name, cost_cents, intake_duration_050, exhaust_duration_050, intake_lift_in, exhaust_lift_in, lsa, intake_centerline
         FROM cams WHERE CONCAT(sku, ' ', name) IN (?) ORDER BY id`,
      { replacements: [cardNames], type: QueryTypes.SELECT },
    );
    return cardNames.map((cardName) => {
      const row = rows.find((r) => `${r.sku} ${r.name}` === cardName);
      if (!row) throw new Error(`no cam in the database is shown as ${cardName}`);
      return row;
    });
  };

  it('compares the chosen cams and shows them to the customer with the staff table’s job prices and no costs', async () => {
    const page = await openShortlist(browser, 1280);
    const staff = await staffRows(page);
    expect(staff.length).toBeGreaterThanOrEqual(6);
    for (const row of staff.slice(0, 6)) expect(row.jobPrice).toMatch(/^\$\d{1,3}(,\d{3})*\.\d{2}$/);
    const compareButton = page.getByRole('button', { name: 'Compare side by side' });
    const showButton = page.getByRole('button', { name: 'Show to the customer' });

    // The top three are charted at first. Take the third off and put the fifth on, from the keyboard.
    await expect(chartBox(page, staff[2].cardName).isChecked()).resolves.toBe(true);
    await pressOn(chartBox(page, staff[2].cardName), 'Space');
    await expect(chartBox(page, staff[2].cardName).isChecked()).resolves.toBe(false);
    await pressOn(chartBox(page, staff[4].cardName), 'Space');
    const chosen = [staff[0], staff[1], staff[4]];
    await page.getByText(`Chosen: ${chosen.map((c) => c.cardName).join(', ')}`).waitFor();
    // Four on the chart is one too many to compare: both buttons wait until there are two or three again.
    await pressOn(chartBox(page, staff[5].cardName), 'Space');
    await page.getByText('(4 on the chart now)').waitFor();
    await expect(compareButton.isDisabled()).resolves.toBe(true);
    await expect(showButton.isDisabled()).resolves.toBe(true);
    await pressOn(chartBox(page, staff[5].cardName), 'Space');
    await expect(showButton.isEnabled()).resolves.toBe(true);

    // Side by side on the staff page: one column per chosen cam, the cards' own figures and the table's prices.
    await pressOn(compareButton, 'Enter');
    await expect(page.getByRole('button', { name: 'Hide the comparison' }).getAttribute('aria-expanded')).resolves.toBe(
      'true',
    );
    const comparison = page.getByRole('table', { name: 'Chosen cams side by side' });
    await comparison.waitFor();
    const headers = (await comparison.locator('thead th').allTextContents()).map((t) => t.trim());
    expect(headers).toEqual(chosen.map((c) => c.cardName));
    const cells = async (table: Locator, key: string) =>
      (await table.locator(`tr[data-row="${key}"] td`).allTextContents()).map((t) => t.trim());
    expect(await cells(comparison, 'price')).toEqual(chosen.map((c) => c.jobPrice));
    const cams = await camsByCardName(chosen.map((c) => c.cardName));
    const durations = await cells(comparison, 'duration');
    expect(durations).toEqual(cams.map((c) => `${degree(c.intake_duration_050)} / ${degree(c.exhaust_duration_050)}`));
    expect(await cells(comparison, 'lift')).toEqual(
      cams.map((c) => `${Number(c.intake_lift_in).toFixed(3)}" / ${Number(c.exhaust_lift_in).toFixed(3)}"`),
    );
    expect(await cells(comparison, 'lsa')).toEqual(cams.map((c) => degree(c.lsa)));
    expect(await cells(comparison, 'icl')).toEqual(cams.map((c) => degree(c.intake_centerline)));
    for (const key of ['ivo', 'ivc', 'evo', 'evc'])
      for (const cell of await cells(comparison, key)) expect(cell).toMatch(/^\d+(\.\d)?° (before|after) [TB]DC$/);
    for (const cell of await cells(comparison, 'overlap'))
      expect(cell).toMatch(/^(None at 0\.050" \(−\d+(\.\d)?°\)|\d+(\.\d)?°)$/);
    for (const cell of await cells(comparison, 'dcr')) expect(cell).toMatch(/^\d\.\d:1$/);
    for (const cell of await cells(comparison, 'vacuum'))
      expect(cell).toMatch(/^About \d+(\.\d)? inHg: (enough|less than)/);
    for (const cell of await cells(comparison, 'needs')) expect(cell).toContain('Fitting');
    await expectNoSeriousA11yViolations(page);

    // Turned to the customer, from the keyboard; the way back takes the focus.
    await pressOn(showButton, 'Enter');
    const view = page.getByRole('dialog', { name: 'Your cam choices' });
    await view.waitFor();
    await expect(page.evaluate(() => document.activeElement?.textContent)).resolves.toBe('Back to the shop view');
    const grindNames = cams.map((c) => c.name);
    await expect(view.locator('[data-customer-cam] h3').allTextContents()).resolves.toEqual(grindNames);
    await expect(view.locator('[data-customer-price]').allTextContents()).resolves.toEqual(
      chosen.map((c) => c.jobPrice),
    );
    const customerTable = view.getByRole('table', { name: 'The chosen cams side by side' });
    expect((await customerTable.locator('thead th').allTextContents()).map((t) => t.trim())).toEqual(grindNames);
    expect(await cells(customerTable, 'price')).toEqual(chosen.map((c) => c.jobPrice));
    // (The staff page under the open view is inert: its comparison was read before the screen was turned.)
    expect(await cells(customerTable, 'duration')).toEqual(durations);
    await expect(
      view.getByRole('img', { name: /Estimated pulling power .* for your engine now and for/ }).isVisible(),
    ).resolves.toBe(true);
    expect(await view.locator('canvas').count()).toBe(1);

    const said = (await view.textContent()) ?? '';
    for (const caution of [
      /qualified technician/,
      /piston-to-valve clearance/,
      /re-tuned/,
      /Emissions:/,
      /Local codes and licensed practice come first/,
    ])
      expect(said).toMatch(caution);
    expect(said).not.toMatch(/\bcosts?\b|margin|\/100|in stock|None: order/i);
    for (const cam of cams) expect(said).not.toContain(money(cam.cost_cents));
    expect(SHOP_CODES.filter((code) => said.includes(code))).toEqual([]);
    await expectNoSeriousA11yViolations(page);
    await expectNoSidewaysScroll(page);
    await page.screenshot({ path: path.join(SHOTS, 'customer-view-desktop.png') });

    // Printed, the customer view is the whole page: none of the staff screen under it reaches the paper.
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByRole('heading', { name: 'Cam shortlist' }).isVisible()).resolves.toBe(false);
    await expect(view.getByRole('heading', { name: 'Your cam choices' }).isVisible()).resolves.toBe(true);
    await expect(view.getByRole('button', { name: 'Back to the shop view' }).isVisible()).resolves.toBe(false);
    const pdf = await page.pdf({ format: 'Letter', printBackground: true });
    fs.writeFileSync(path.join(SHOTS, 'customer-view-print.pdf'), pdf);
    const printed = pdfText(pdf).replace(/\s+/g, ' ');
    for (const grind of grindNames) expect(printed).toContain(grind);
    for (const c of chosen) expect(printed).toContain(c.jobPrice);
    expect(printed).toContain('qualified technician');
    expect(printed).not.toMatch(/Cam shortlist|Out-pulls now from|Only emissions-certified cams/);
    await page.emulateMedia({ media: 'screen' });

    // Escape turns the screen back: the staff table again, the focus on the button that opened the view.
    await page.keyboard.press('Escape');
    await view.waitFor({ state: 'detached' });
    await expect(page.evaluate(() => document.activeElement?.textContent)).resolves.toBe('Show to the customer');
    await expect(ranked(page).isVisible()).resolves.toBe(true);
    await page.context().close();
  });

  it('fits a phone: the customer view of the top three at 390 px, opened and closed with clicks', async () => {
    const page = await openShortlist(browser, 390);
    const staff = await staffRows(page);
    await page.getByRole('button', { name: 'Show to the customer' }).click();
    const view = page.getByRole('dialog', { name: 'Your cam choices' });
    await view.waitFor();
    await expect(view.locator('[data-customer-price]').allTextContents()).resolves.toEqual(
      staff.slice(0, 3).map((c) => c.jobPrice),
    );
    await expect(
      view.getByText('Local codes and licensed practice come first', { exact: false }).isVisible(),
    ).resolves.toBe(true);
    await expectNoSidewaysScroll(page);
    // Large type for reading across the counter: the prices at 24 px or more, body text at 18 px.
    const sizes = await view.evaluate((dialog) => ({
      price: parseFloat(getComputedStyle(dialog.querySelector('[data-customer-price]')!).fontSize),
      body: parseFloat(getComputedStyle(dialog.querySelector('[data-customer-cam] li')!).fontSize),
    }));
    expect(sizes.price).toBeGreaterThanOrEqual(24);
    expect(sizes.body).toBeGreaterThanOrEqual(18);
    await expectNoSeriousA11yViolations(page);
    // The view scrolls inside itself (a full-screen dialog), so each shot is one screenful.
    await page.screenshot({ path: path.join(SHOTS, 'customer-view-phone.png') });
    await view.getByRole('table', { name: 'The chosen cams side by side' }).scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SHOTS, 'customer-view-phone-comparison.png') });
    await view.getByRole('button', { name: 'Back to the shop view' }).click();
    await view.waitFor({ state: 'detached' });
    await expect(ranked(page).isVisible()).resolves.toBe(true);
    await page.context().close();
  });
});
