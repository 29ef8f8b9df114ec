import type { Browser, Page } from 'playwright-core';
import { Cam } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// The counter's shortlist shows how many of each cam are on the shelf and can leave out every cam that is
// not emissions-certified, as a person uses it: pick the build, read the table, tick the box. One cam's
// stock is set to zero for the test and put back afterwards.
const { appUrl } = readRuntime();

describe('the shortlist: stock on hand and the certified-only filter', () => {
  let browser: Browser;
  let page: Page;
  let emptied: { id: number; stock: number; name: string } | null = null;
  const pageErrors: string[] = [];
  const rows = () => page.locator('table tbody tr');
  /** Each row's cam name and its "On hand" cell, read from the table as shown. */
  async function table(): Promise<{ cam: string; onHand: string }[]> {
    const headers = await page.locator('table thead th').allTextContents();
    const column = headers.indexOf('On hand');
    expect(column).toBeGreaterThan(0);
    return rows().evaluateAll(
      (trs, col) =>
        trs.map((tr) => ({
          cam: tr.querySelector('td:nth-child(2) button')?.textContent ?? '',
          onHand: tr.children[col]?.textContent ?? '',
        })),
      column,
    );
  }

  beforeAll(async () => {
    connectTestDatabase();
    const cam = (await Cam.findOne({ where: { sku: 'LV-224' } }))!;
    emptied = { id: cam.id, stock: cam.stockOnHand, name: cam.name };
    await cam.update({ stockOnHand: 0 });
    browser = await launchBrowser();
    const context = await staffContext(browser, 'counter');
    page = await watchedPage(context, pageErrors, 15_000);
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
    if (emptied) await Cam.update({ stockOnHand: emptied.stock }, { where: { id: emptied.id } });
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('shows each cam’s stock from the catalogue, and “None: order” for an empty shelf', async () => {
    await page.goto(`${appUrl}/advisor`);
    // The first build the list offers (index 0 is "Pick a build…"): the list shows the most recent builds,
    // so a fixed id may not be among them once earlier tests have saved builds.
    await page.getByLabel('Build').selectOption({ index: 1 });
    await rows().first().waitFor();
    const shown = await table();
    expect(shown.length).toBeGreaterThanOrEqual(10);
    const cams = await Cam.findAll({ where: { isFactoryBaseline: false, active: true } });
    for (const row of shown) {
      const cam = cams.find((c) => row.cam === `${c.sku} ${c.name}`);
      expect(cam).toBeDefined();
      expect(row.onHand).toBe(cam!.stockOnHand > 0 ? `${cam!.stockOnHand} in stock` : 'None: order');
    }
    expect(shown.find((r) => r.cam.endsWith(emptied!.name))!.onHand).toBe('None: order'); // LV-224, emptied above
    // Unfiltered, the table holds the uncertified cams too.
    const uncertified = cams.filter((c) => !c.emissionsCertified).map((c) => `${c.sku} ${c.name}`);
    expect(shown.filter((r) => uncertified.includes(r.cam)).length).toBe(uncertified.length);
    await expectNoSeriousA11yViolations(page);
  }, 60_000);

  it('ticking “Only emissions-certified cams” leaves out every uncertified cam, and unticking brings them back', async () => {
    const all = (await table()).length;
    const certified = await Cam.findAll({
      where: { isFactoryBaseline: false, active: true, emissionsCertified: true },
    });
    await page.getByLabel('Only emissions-certified cams').check();
    await page
      .getByRole('status')
      .filter({
        hasText: `${certified.length} of ${all} cams shown; ${all - certified.length} not certified left out.`,
      })
      .waitFor();
    const shown = await table();
    expect(shown.map((r) => r.cam).sort()).toEqual(certified.map((c) => `${c.sku} ${c.name}`).sort());
    await expectNoSeriousA11yViolations(page);
    await page.getByLabel('Only emissions-certified cams').uncheck();
    await page
      .getByRole('status')
      .filter({ hasText: `All ${all} cams shown.` })
      .waitFor();
    expect((await table()).length).toBe(all);
  }, 60_000);
});
