import type { Browser, Page } from 'playwright-core';
import { Op } from 'sequelize';
import { AuditEntry, DynoRun } from '@/lib/db/models';
import { expectNoSeriousA11yViolations } from '../support/a11y';
import { launchBrowser, staffContext, watchedPage } from '../support/browser';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';
import { removeDynoRuns } from '../support/dyno-runs';
import { DEMO } from '../support/demo';

// Engine dyno or chassis dyno, chosen on the job page as the technician records each pull: the table says
// which, and the chart compares a chassis before pull only with chassis after pulls (an engine-dyno pull
// reads at the flywheel, without the driveline's loss). Demo job Q-2026-0102 (quote 2, build 2); runs made
// here are deleted afterwards.
const { appUrl } = readRuntime();
const BUILD_ID = DEMO.builds.okaforStreetTruck;
const WHEELS_BEFORE = '3000,300\n4000,330\n5000,310\n5500,290';
const FLYWHEEL_AFTER = '3000,370\n4000,405\n5000,400\n6000,380';
const WHEELS_AFTER = '3000,295\n4000,335\n5000,330\n6000,310';
const FLYWHEEL_BEFORE = '3000,350\n4000,385\n5000,370\n5500,350';

describe('chassis and engine dyno runs on the job page', () => {
  let browser: Browser;
  let page: Page;
  let firstNewId = 0;
  const pageErrors: string[] = [];
  const form = () => page.getByRole('form', { name: 'Record a dyno run' });
  const runRows = () =>
    page
      .getByRole('table')
      .filter({ has: page.getByText('Recorded dyno runs') })
      .locator('tbody tr');

  async function typePull(pull: string) {
    await form()
      .getByLabel(/^Pull points/)
      .click();
    await page.keyboard.press('ControlOrMeta+a');
    await page.keyboard.press('Backspace');
    await page.keyboard.type(pull);
  }
  async function record(phase: 'before' | 'after', dyno: 'chassis' | 'engine', pull: string, rows: number) {
    await form().getByLabel('Pull', { exact: true }).selectOption(phase);
    await form().getByLabel('Dyno', { exact: true }).selectOption(dyno);
    await typePull(pull);
    await page.keyboard.press('ControlOrMeta+Enter');
    await form().getByRole('status').filter({ hasText: 'Run recorded.' }).waitFor();
    await runRows()
      .nth(rows - 1)
      .waitFor();
  }

  beforeAll(async () => {
    connectTestDatabase();
    firstNewId = ((await DynoRun.max<number, DynoRun>('id')) ?? 0) + 1;
    browser = await launchBrowser();
    const context = await staffContext(browser, 'tech');
    page = await watchedPage(context, pageErrors);
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
    const ids = (
      await DynoRun.findAll({ where: { buildId: BUILD_ID, id: { [Op.gte]: firstNewId } }, attributes: ['id'] })
    ).map((r) => r.id);
    await removeDynoRuns(ids);
    await AuditEntry.destroy({ where: { entityType: 'dyno-run', entityId: { [Op.in]: ids.map(String) } } });
    await disconnectTestDatabase();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it('records a chassis before pull and an engine after pull, and leaves the engine pull out of the chassis chart', async () => {
    await page.goto(`${appUrl}/jobs`);
    await page.getByRole('link', { name: 'Q-2026-0102' }).click();
    await form().waitFor();
    // Chassis is the preselected kind: the shop's usual dyno for a car on the rollers.
    await expect(form().getByLabel('Dyno', { exact: true }).inputValue()).resolves.toBe('chassis');
    await form().getByLabel('Correction to standard air').selectOption('none');
    await record('before', 'chassis', WHEELS_BEFORE, 1);
    await record('after', 'engine', FLYWHEEL_AFTER, 2);

    const rows = await runRows().allTextContents();
    expect(rows[0]).toMatch(/^BeforeChassis/);
    expect(rows[1]).toMatch(/^AfterEngine/);
    const stored = await DynoRun.findAll({
      where: { buildId: BUILD_ID, id: { [Op.gte]: firstNewId } },
      order: [['id', 'ASC']],
    });
    expect(stored.map((r) => [r.phase, r.dynoType])).toEqual([
      ['before', 'chassis'],
      ['after', 'engine'],
    ]);

    await page
      .getByRole('img', { name: /on the chassis dyno: the before pull \(solid grey\) and 0 after pull/ })
      .waitFor();
    await page
      .getByText('1 after pull on the engine dyno is left out: a chassis run is compared only with chassis runs.')
      .waitFor();
    await expectNoSeriousA11yViolations(page);
  }, 90_000);

  it('a chassis after pull is drawn against the chassis before pull', async () => {
    await record('after', 'chassis', WHEELS_AFTER, 3);
    await page
      .getByRole('img', { name: /on the chassis dyno: the before pull \(solid grey\) and 1 after pull/ })
      .waitFor();
    await page.getByText('1 after pull on the engine dyno is left out').waitFor();
    // The form keeps the last choice of dyno for the next pull, like the air and the correction.
    await expect(form().getByLabel('Dyno', { exact: true }).inputValue()).resolves.toBe('chassis');
    await expectNoSeriousA11yViolations(page);
  }, 90_000);

  it('an engine before pull makes the chart an engine-dyno one, with the advisor’s prediction for the fitted cam and its band', async () => {
    const asked = page.waitForRequest((r) => r.url().endsWith('/api/advisor/rank') && r.method() === 'POST');
    const answered = page.waitForResponse((r) => r.url().endsWith('/api/advisor/rank'));
    await record('before', 'engine', FLYWHEEL_BEFORE, 4);
    // The prediction leaves this build's own pulls out of the shop history it learns from.
    const body = JSON.parse((await asked).postData() ?? '{}') as { camIds?: number[]; excludeBuildId?: number };
    expect(body.excludeBuildId).toBe(BUILD_ID);
    expect(body.camIds).toHaveLength(1);
    expect((await answered).status()).toBe(200);
    await page
      .getByRole('img', {
        name: /on the engine dyno: the before pull \(solid grey\) and 1 after pull\(s\), with the advisor’s predicted curve for the fitted cam and its band/,
      })
      .waitFor();
    await page.getByText(/The advisor’s prediction for this build and cam is drawn with its shaded band/).waitFor();
    await page.getByText('1 after pull on the chassis dyno is left out', { exact: false }).waitFor();
    await expectNoSeriousA11yViolations(page);
  }, 90_000);
});
