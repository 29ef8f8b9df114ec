import type { Browser, Page } from 'playwright-core';
import { Op } from 'sequelize';
import { AuditEntry, DynoRun, ShopSettings } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { removeDynoRuns } from '../support/dyno-runs';
import { DEMO } from '../support/demo';

// A shop that reads its dyno cell in °C and kPa (issue 9, item 1): the manager switches the setting on the
// settings page, then the technician records a pull on demo job Q-2026-0102 typing °C and kPa, is told in
// kPa when a reading is off, and sees the run saved and shown in °C and kPa. Stored in °C and kPa as always.
// The setting and the runs made here are put back afterwards.
const { appUrl } = readRuntime();
const BUILD_ID = DEMO.builds.okaforStreetTruck;
const PULL = '3000,352\n3500,371\n4000,380\n4500,372\n5000,350';

describe('dyno air in °C and kPa by the shop’s setting', () => {
  let browser: Browser;
  let manager: Page;
  let tech: Page;
  let firstNewId = 0;
  let unitsBefore: 'imperial' | 'metric' = 'imperial';
  const pageErrors: string[] = [];
  const form = () => tech.getByRole('form', { name: 'Record a dyno run' });

  async function typeInto(page: Page, label: string | RegExp, text: string) {
    await page.getByLabel(label, { exact: typeof label === 'string' }).click();
    await page.keyboard.press('ControlOrMeta+a');
    await page.keyboard.press('Backspace');
    if (text) await page.keyboard.type(text);
  }

  beforeAll(async () => {
    connectTestDatabase();
    firstNewId = ((await DynoRun.max<number, DynoRun>('id')) ?? 0) + 1;
    unitsBefore = (await ShopSettings.findOne({ order: [['id', 'ASC']] }))!.dynoAirUnits;
    browser = await launchBrowser();
    manager = await watchedPage(await staffContext(browser, 'manager'), pageErrors);
    tech = await watchedPage(await staffContext(browser, 'tech'), pageErrors);
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
    await ShopSettings.update({ dynoAirUnits: unitsBefore }, { where: {} });
    const ids = (
      await DynoRun.findAll({ where: { buildId: BUILD_ID, id: { [Op.gte]: firstNewId } }, attributes: ['id'] })
    ).map((r) => r.id);
    await removeDynoRuns(ids);
    await AuditEntry.destroy({ where: { entityType: 'dyno-run', entityId: { [Op.in]: ids.map(String) } } });
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('the manager switches the shop to °C and kPa on the settings page', async () => {
    await manager.goto(`${appUrl}/catalogue/settings`);
    const choice = manager.getByLabel('Dyno air conditions in');
    await expect(choice.inputValue()).resolves.toBe('imperial');
    await manager.getByText('Dyno air in °F and inHg.').waitFor();
    await choice.focus();
    await manager.keyboard.press('ArrowDown'); // the next choice: °C and kPa
    await expect(choice.inputValue()).resolves.toBe('metric');
    await manager.getByRole('button', { name: 'Save settings' }).click();
    await manager.getByText('Settings saved').waitFor();
    await manager.getByText('Dyno air in °C and kPa.').waitFor();
    expect((await ShopSettings.findOne({ order: [['id', 'ASC']] }))!.dynoAirUnits).toBe('metric');
    await expectNoSeriousA11yViolations(manager);
  }, 90_000);

  it('the technician types °C and kPa on the job page, is told in kPa when a reading is off, and sees the run in °C and kPa', async () => {
    await tech.goto(`${appUrl}/jobs`);
    await tech.getByRole('link', { name: 'Q-2026-0102' }).click();
    await form().waitFor();
    await form().getByText('In °C and kPa, the shop’s setting').waitFor();
    // The boxes carry the unit and the range in °C and kPa (the schema's own limits, unconverted).
    await form().getByText('-20–60 °C', { exact: false }).waitFor();
    await form().getByText('70–110 kPa', { exact: false }).waitFor();

    await form().getByLabel('Correction to standard air').selectOption('sae-j1349');
    await form().getByLabel('Pull', { exact: true }).selectOption('before');
    await typeInto(tech, 'Air temperature', '21.5');
    // Someone reads the glass in inHg out of habit: refused in the shop's units before anything is sent.
    await typeInto(tech, 'Barometric pressure', '29.53');
    await typeInto(tech, 'Relative humidity', '40');
    await typeInto(tech, /^Pull points/, PULL);
    await form().getByRole('button', { name: 'Record run' }).click();
    await form().getByText('barometric pressure must be at least 70 kPa').waitFor();
    expect(await DynoRun.count({ where: { buildId: BUILD_ID, id: { [Op.gte]: firstNewId } } })).toBe(0);

    await typeInto(tech, 'Barometric pressure', '99.2');
    await form().getByText('barometric pressure must be at least 70 kPa').waitFor({ state: 'detached' });
    await form().getByRole('button', { name: 'Record run' }).click();
    await form().getByRole('status').filter({ hasText: 'Run recorded.' }).waitFor();

    const row = tech
      .getByRole('table')
      .filter({ has: tech.getByText('Recorded dyno runs') })
      .locator('tbody tr')
      .first();
    await row.waitFor();
    await expect(row.textContent()).resolves.toContain('21.5 °C · 99.2 kPa · 40 %');

    // Stored as typed: the API and the database keep °C and kPa whatever the setting says.
    const stored = await DynoRun.findAll({ where: { buildId: BUILD_ID, id: { [Op.gte]: firstNewId } } });
    expect(stored).toHaveLength(1);
    expect(stored[0].airTempC).toBeCloseTo(21.5, 9);
    expect(stored[0].baroKpa).toBeCloseTo(99.2, 9);
    expect(stored[0].humidityPct).toBe(40);
    await expectNoSeriousA11yViolations(tech);
  }, 90_000);

  it('shows the same run in °F and inHg once the shop is back on them', async () => {
    await ShopSettings.update({ dynoAirUnits: 'imperial' }, { where: {} });
    await tech.reload();
    await form().getByText('In °F and inHg, the shop’s setting').waitFor();
    const row = tech
      .getByRole('table')
      .filter({ has: tech.getByText('Recorded dyno runs') })
      .locator('tbody tr')
      .first();
    await row.waitFor();
    // 21.5 °C × 9/5 + 32 = 70.7 °F, shown whole; 99.2 kPa ÷ 3.38639 = 29.29 inHg.
    await expect(row.textContent()).resolves.toContain('71 °F · 29.29 inHg · 40 %');
  }, 90_000);
});
