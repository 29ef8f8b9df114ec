import type { Browser, Page } from 'playwright-core';
import { ShopSettings } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// The manager enters the shop's rates as percents (8.25 %, not 825 basis points): tax, deposit and the
// discount counter staff may give without a manager. They are stored as basis points; what was there is
// put back afterwards.
const { appUrl } = readRuntime();

describe('shop rates in percent on the settings page', () => {
  let browser: Browser;
  let page: Page;
  const pageErrors: string[] = [];
  let before: { taxRateBp: number; depositPercentBp: number; maxCounterDiscountBp: number };
  const box = (label: RegExp) => page.getByLabel(label);

  async function typeInto(label: RegExp, text: string) {
    await box(label).click();
    await page.keyboard.press('ControlOrMeta+a');
    await page.keyboard.type(text);
  }

  beforeAll(async () => {
    connectTestDatabase();
    const s = (await ShopSettings.findOne({ order: [['id', 'ASC']] }))!;
    before = {
      taxRateBp: s.taxRateBp,
      depositPercentBp: s.depositPercentBp,
      maxCounterDiscountBp: s.maxCounterDiscountBp,
    };
    browser = await launchBrowser();
    page = await watchedPage(await staffContext(browser, 'manager'), pageErrors);
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
    await ShopSettings.update(before, { where: {} });
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('shows the stored rates as percents, saves typed percents as basis points, and refuses one out of range', async () => {
    await page.goto(`${appUrl}/catalogue/settings`);
    await expect(box(/^Tax rate/).inputValue()).resolves.toBe(String(before.taxRateBp / 100));
    await expect(box(/^Deposit$/).inputValue()).resolves.toBe(String(before.depositPercentBp / 100));

    await typeInto(/^Tax rate/, '7.75');
    await typeInto(/^Deposit$/, '25');
    await typeInto(/^Counter staff may discount up to/, '12.5');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved').waitFor();
    const saved = (await ShopSettings.findOne({ order: [['id', 'ASC']] }))!;
    expect([saved.taxRateBp, saved.depositPercentBp, saved.maxCounterDiscountBp]).toEqual([775, 2500, 1250]);
    await expectNoSeriousA11yViolations(page);

    await typeInto(/^Tax rate/, '31');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('tax rate must be between 0 % and 30 %').waitFor();
    expect((await ShopSettings.findOne({ order: [['id', 'ASC']] }))!.taxRateBp).toBe(775);
    await expectNoSeriousA11yViolations(page);
  }, 90_000);
});
