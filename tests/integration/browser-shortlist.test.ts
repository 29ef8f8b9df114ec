import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext } from '../support/browser';
import { readRuntime } from '../support/runtime';

const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');

describe('cam shortlist page in a real browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
  });
  afterAll(() => browser?.close());

  it('ranks the demo build, draws the chart and opens a cam’s reasons from the keyboard', async () => {
    const context = await staffContext(browser, 'counter');
    const page = await context.newPage();
    await page.goto(`${appUrl}/advisor`);
    await page.getByRole('heading', { name: 'Cam shortlist' }).waitFor();
    // Nothing is ranked until a build is picked (never some other customer's build by default).
    await page.getByText('Pick the customer’s build above').waitFor();
    await expect(page.locator('table').count()).resolves.toBe(0);
    await page.getByLabel('Build').selectOption({ index: 1 });
    const rows = page.locator('table tbody tr');
    await rows.first().waitFor();
    expect(await rows.count()).toBeGreaterThanOrEqual(10);
    expect(await page.locator('canvas').count()).toBe(1);
    // One metric at a time by default, each prediction with its shaded band; the reader can switch.
    await expect(page.getByLabel('Torque', { exact: true }).isChecked()).resolves.toBe(true);
    await page.getByText('Shaded: the prediction’s band').waitFor();
    await page.getByLabel('Power', { exact: true }).check();
    await expect(page.getByRole('img', { name: /Predicted power from/ }).isVisible()).resolves.toBe(true);
    // The crossover is a range, not one rpm: the table shows both ends where the band moves it.
    const crossoverCells = await rows.locator('td:nth-child(4)').allTextContents();
    expect(crossoverCells.some((t) => /\d–[\d,]+ rpm/.test(t))).toBe(true);
    await expect(page.getByText('Predictions are indicative: an engine-cycle model').isVisible()).resolves.toBe(true);

    const firstCam = page.locator('table tbody tr').first().getByRole('button');
    await firstCam.focus();
    await page.keyboard.press('Enter');
    await expect(firstCam.getAttribute('aria-expanded')).resolves.toBe('true');
    await page.getByText('Why it ranks here').waitFor();
    await page.getByText('How these numbers were reached').click();
    await expect(page.getByText('definition of horsepower').isVisible()).resolves.toBe(true);
    // The model's own figures load on opening: one row per simulated rpm, BMEP = IMEP − friction.
    const perRpm = page.getByRole('table', { name: 'Per simulated rpm' });
    await perRpm.waitFor();
    const modelRows = perRpm.locator('tbody tr');
    expect(await modelRows.count()).toBeGreaterThanOrEqual(8);
    const cells = (await modelRows.first().locator('td').allTextContents()).map((t) => Number(t.replace(/,/g, '')));
    expect(cells[0]).toBe(1500);
    expect(Math.abs(cells[3] - cells[5] - cells[6])).toBeLessThanOrEqual(0.15);
    await page.getByRole('table', { name: /Head flow against valve lift/ }).waitFor();
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'shortlist-desktop.png'), fullPage: true });
    await context.close();
  });

  it('sends a signed-out visitor to sign in and back', async () => {
    const page = await browser.newPage();
    await page.goto(`${appUrl}/advisor`);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(new URL(page.url()).searchParams.get('next')).toBe('/advisor');
    await expectNoSeriousA11yViolations(page);
    await page.close();
  });
});
