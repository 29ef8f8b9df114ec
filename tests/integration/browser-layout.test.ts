import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousA11yViolations } from '../support/a11y';
import { launchBrowser } from '../support/browser';
import { signIn, type TestRole } from '../support/auth';
import { readRuntime } from '../support/runtime';
import { DEMO } from '../support/demo';

// Layout measured from the browser's own boxes (getBoundingClientRect, Range.getClientRects), not by
// comparing screenshots by eye: at 1280 px the staff header stays on one row for every role, lift values
// in the cam table never break over two lines, and neither at 1280 px nor at 390 px (a phone) does a main page
// scroll sideways.
const { appUrl } = readRuntime();

const PAGES: Record<TestRole | 'public', string[]> = {
  public: ['/', '/ask', '/sign-in', '/forgot-password'],
  counter: [
    '/dashboard',
    '/interviews',
    '/interviews/new',
    `/advisor?build=${DEMO.builds.whitlockTowingTruck}`,
    '/leads',
    '/quotes',
    `/quotes/${DEMO.quotes.whitlockSent}`,
    '/catalogue',
    '/catalogue/cams',
    `/catalogue/cams/${DEMO.cams.easyDaily194}`,
    '/catalogue/parts',
    '/catalogue/labor',
    '/catalogue/rules',
    '/account',
  ],
  tech: ['/jobs', `/jobs/${DEMO.quotes.okaforDepositPaid}`],
  manager: ['/reports', '/staff', '/catalogue/settings', '/catalogue/cams/new', '/catalogue/cams/import'],
};

/** How far the page reaches past the window's right edge, and the element that reaches furthest. */
function sidewaysOverflow(page: Page) {
  return page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    let widest: { tag: string; text: string; right: number } | null = null;
    for (const el of document.querySelectorAll('body *')) {
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.right <= width + 1) continue;
      // Inside a container that scrolls on its own (a wide table), reaching past the edge is fine, unless the
      // element is positioned absolutely and the container is not positioned (then it escapes the clip).
      let needPositioned = getComputedStyle(el).position === 'absolute';
      let clipped = false;
      for (let p = el.parentElement; p && p !== document.body; p = p.parentElement) {
        const style = getComputedStyle(p);
        if (needPositioned) {
          if (style.position === 'static') continue;
          needPositioned = false;
        }
        if (['auto', 'scroll', 'hidden', 'clip'].includes(style.overflowX)) {
          clipped = true;
          break;
        }
      }
      if (!clipped && (!widest || box.right > widest.right))
        widest = {
          tag: el.tagName.toLowerCase(),
          text: (el.textContent ?? '').trim().slice(0, 40),
          right: Math.round(box.right),
        };
    }
    return { excess: document.documentElement.scrollWidth - width, widest };
  });
}

/** The header's pieces: the brand, each link, who is signed in, the sign-out button. */
function headerRows(page: Page) {
  return page.evaluate(() => {
    const header = document.querySelector('body > header')!;
    const items = [
      header.querySelector('a[href="/"]')!,
      ...header.querySelectorAll('nav li'),
      ...header.querySelectorAll('nav > span, nav > button, nav > form'),
    ];
    const boxes = items.map((el) => ({
      text: (el.textContent ?? '').trim().slice(0, 30),
      top: el.getBoundingClientRect().top,
      bottom: el.getBoundingClientRect().bottom,
    }));
    // Items on one row overlap vertically: every item's box crosses the middle line of the first one.
    const middle = (boxes[0].top + boxes[0].bottom) / 2;
    return {
      count: boxes.length,
      offRow: boxes.filter((b) => b.top > middle || b.bottom < middle).map((b) => b.text),
      headerHeight: header.getBoundingClientRect().height,
    };
  });
}

/** How many lines each lift cell in the cam table takes (distinct line tops of its text). */
function liftLines(page: Page) {
  return page.evaluate(() => {
    const table = document.querySelector('main table')!;
    const column = [...table.querySelectorAll('thead th')].findIndex((th) => /Lift/.test(th.textContent ?? ''));
    return [...table.querySelectorAll('tbody tr')].map((tr) => {
      const cell = tr.children[column];
      const range = document.createRange();
      range.selectNodeContents(cell);
      const tops = new Set([...range.getClientRects()].filter((r) => r.width > 0).map((r) => Math.round(r.top)));
      return { text: (cell.textContent ?? '').trim(), lines: tops.size };
    });
  });
}

describe('layout at 1280 px and 390 px', () => {
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  const pageErrors: string[] = [];

  async function pageFor(role: TestRole | 'public', width: number): Promise<Page> {
    const context = await browser.newContext({
      viewport: { width, height: 900 },
      isMobile: width < 500,
      hasTouch: width < 500,
    });
    contexts.push(context);
    if (role !== 'public') {
      const [name, value] = (await signIn(role)).split('=');
      await context.addCookies([{ name, value, url: appUrl }]);
    }
    const page = await context.newPage();
    page.setDefaultTimeout(15_000);
    page.on('pageerror', (error) => pageErrors.push(`${page.url()}: ${error.message}`));
    return page;
  }
  async function open(page: Page, path: string) {
    await page.goto(`${appUrl}${path}`, { waitUntil: 'load' });
    expect(new URL(page.url()).pathname).toBe(path.split('?')[0]);
    // Lists and the shortlist fill in after the first paint; measure what a person ends up looking at.
    if (path.startsWith('/advisor')) await page.locator('main table tbody tr').first().waitFor();
    if (path === '/catalogue/cams') await page.locator('main table tbody tr').first().waitFor();
    await page.waitForLoadState('networkidle');
  }

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
  });
  afterEach(() => expect(pageErrors).toEqual([]));

  it.each(['manager', 'counter', 'tech'] as const)(
    'at 1280 px the %s’s header is one row',
    async (role) => {
      const page = await pageFor(role, 1280);
      await open(page, '/dashboard');
      const rows = await headerRows(page);
      expect(rows.count).toBeGreaterThan(4);
      expect(rows.offRow).toEqual([]);
      // One row of 14 px links with padding: well under two rows' height.
      expect(rows.headerHeight).toBeLessThan(70);
    },
    60_000,
  );

  it.each([1280, 390])(
    'at %i px every lift value in the cam table stays on one line',
    async (width) => {
      const page = await pageFor('counter', width);
      await open(page, '/catalogue/cams');
      const cells = await liftLines(page);
      expect(cells.length).toBeGreaterThanOrEqual(10);
      expect(cells.filter((c) => c.lines !== 1)).toEqual([]);
      expect(cells[0].text).toMatch(/^0\.\d{3}" \/ 0\.\d{3}"$|^0\.\d{3} \/ 0\.\d{3}/);
    },
    60_000,
  );

  // The desktop width too (issue 9, item 6: a 1280 px and a 390 px check of every page). axe runs at 390 px
  // below; at 1280 px every browser test that opens a page runs it already.
  it.each(Object.keys(PAGES) as (keyof typeof PAGES)[])(
    'at 1280 px no %s page scrolls sideways',
    async (role) => {
      const page = await pageFor(role, 1280);
      const problems: string[] = [];
      for (const path of PAGES[role]) {
        await open(page, path);
        const { excess, widest } = await sidewaysOverflow(page);
        if (excess > 0)
          problems.push(
            `${path}: ${excess} px too wide (widest: <${widest?.tag}> “${widest?.text}” to ${widest?.right} px)`,
          );
      }
      expect(problems).toEqual([]);
    },
    240_000,
  );

  it.each(Object.keys(PAGES) as (keyof typeof PAGES)[])(
    'at 390 px no %s page scrolls sideways or has a serious accessibility fault (axe)',
    async (role) => {
      const page = await pageFor(role, 390);
      const problems: string[] = [];
      const a11y: string[] = [];
      for (const path of PAGES[role]) {
        await open(page, path);
        const { excess, widest } = await sidewaysOverflow(page);
        if (excess > 0)
          problems.push(
            `${path}: ${excess} px too wide (widest: <${widest?.tag}> “${widest?.text}” to ${widest?.right} px)`,
          );
        a11y.push(...(await seriousA11yViolations(page)));
      }
      expect(problems).toEqual([]);
      expect(a11y).toEqual([]);
    },
    240_000,
  );
});
