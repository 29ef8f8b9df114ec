import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { Op } from 'sequelize';
import { Build, Customer } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser } from '../support/browser';
import { signIn } from '../support/auth';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

// The counter interview in a real browser, driven from the keyboard. The customer it creates carries
// MARK in its name and is deleted afterwards with its build.
const { appUrl } = readRuntime();
const SHOTS = path.resolve(__dirname, '../../var/test/screenshots');
const MARK = `Browser Interview ${process.pid}`;

async function signedInPage(browser: Browser, viewport: { width: number; height: number }): Promise<Page> {
  const [name, value] = (await signIn('counter')).split('=');
  const context = await browser.newContext({ viewport });
  await context.addCookies([{ name, value, url: appUrl }]);
  return context.newPage();
}

const focusedId = (page: Page) => page.evaluate(() => document.activeElement?.id ?? '');

describe('counter interview in a real browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    connectTestDatabase();
    browser = await launchBrowser();
    fs.mkdirSync(SHOTS, { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
    const ids = (await Customer.findAll({ where: { name: { [Op.startsWith]: MARK } }, attributes: ['id'] })).map(
      (c) => c.id,
    );
    if (ids.length) {
      await Build.destroy({ where: { customerId: ids } });
      await Customer.destroy({ where: { id: ids } });
    }
    await disconnectTestDatabase();
  });

  it('fills the interview by keyboard, shows inline limits, saves and lands on the shortlist with the new build ranked', async () => {
    const page = await signedInPage(browser, { width: 1280, height: 900 });
    await page.goto(`${appUrl}/interviews/new`);
    await page.getByRole('heading', { name: 'New interview' }).waitFor();
    await page.waitForFunction(() => document.activeElement?.id === 'f-customer-name');

    // Customer: name, Enter, phone, Enter, e-mail, Enter, notes, Enter → the vehicle.
    await page.keyboard.type(`${MARK} Walk-in`);
    await page.keyboard.press('Enter');
    expect(await focusedId(page)).toBe('f-customer-phone');
    await page.keyboard.type('555-0133');
    await page.keyboard.press('Enter');
    await page.keyboard.type('walk.in.browser@example.com');
    await page.keyboard.press('Enter');
    await page.keyboard.press('Enter');
    expect(await focusedId(page)).toBe('f-vehicleLabel');
    await page.keyboard.type('2015 crew-cab pickup, 5.3 L');

    // Vehicle → kind of vehicle (a truck by default; this one is an SUV) → weight → brakes → use → cruise
    // → cylinders → bore (pre-filled from the 5.3 L preset).
    await page.keyboard.press('Enter');
    expect(await focusedId(page)).toBe('f-profile-vehicle-class');
    expect(await page.inputValue('#f-profile-vehicle-class')).toBe('truck');
    await page.selectOption('#f-profile-vehicle-class', 'suv');
    for (let i = 0; i < 6; i++) await page.keyboard.press('Enter');
    expect(await focusedId(page)).toBe('f-profile-engine-boreIn');
    expect(await page.inputValue('#f-profile-engine-boreIn')).toBe('3.78');
    await page.keyboard.press('ControlOrMeta+a');
    await page.keyboard.type('9');
    await page.keyboard.press('Tab');
    await page.getByText('Problem: bore must be at most 4.6 in').waitFor();
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('ControlOrMeta+a');
    await page.keyboard.type('3.78');
    await page.keyboard.press('Tab');
    await page.getByText('Problem: bore must be at most 4.6 in').waitFor({ state: 'detached' });

    // The emissions caution shows because the default answer is "road-legal emissions needed".
    await expect(
      page
        .getByText('many jurisdictions forbid an aftermarket cam on a road vehicle unless the part is certified')
        .isVisible(),
    ).resolves.toBe(true);

    // Ctrl+Enter saves; the budget is still blank, so the cursor lands there with the reason.
    await page.keyboard.press('Control+Enter');
    await page.waitForFunction(() => document.activeElement?.id === 'f-profile-use-budgetCents');
    await page.getByText('Problem: budget is required ($)').waitFor();
    await page.keyboard.type('3500');
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'interview-desktop.png'), fullPage: true });
    await page.keyboard.press('Control+Enter');

    await page.waitForURL(/\/advisor\?build=\d+$/);
    const buildId = Number(new URL(page.url()).searchParams.get('build'));
    const stored = await Build.findByPk(buildId, { include: [{ model: Customer, as: 'customer' }] });
    expect((stored as Build & { customer: Customer }).customer.name).toBe(`${MARK} Walk-in`);
    expect(stored!.vehicleLabel).toBe('2015 crew-cab pickup, 5.3 L');
    expect((stored!.profile as { use: { budgetCents: number } }).use.budgetCents).toBe(350000);
    expect((stored!.profile as { vehicle: { class: string } }).vehicle.class).toBe('suv');
    expect(stored!.profileSchemaVersion).toBe(2);

    await page.getByRole('heading', { name: 'Cam shortlist' }).waitFor();
    expect(await page.inputValue('select')).toBe(String(buildId));
    const rows = page.locator('table tbody tr');
    await rows.first().waitFor();
    expect(await rows.count()).toBeGreaterThanOrEqual(10);
    await expect(page.getByText('Emissions: not certified').first().isVisible()).resolves.toBe(true);
    await expectNoSeriousA11yViolations(page);
    await page.context().close();
  });

  it('fits a phone screen without sideways scrolling', async () => {
    const page = await signedInPage(browser, { width: 390, height: 844 });
    await page.goto(`${appUrl}/interviews/new`);
    await page.getByRole('heading', { name: 'New interview' }).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    await expectNoSeriousA11yViolations(page);
    await page.screenshot({ path: path.join(SHOTS, 'interview-phone.png'), fullPage: true });
    expect(overflow).toBeLessThanOrEqual(0);
    await page.context().close();
  });
});
