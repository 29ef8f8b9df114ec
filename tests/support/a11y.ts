import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';

// axe-core's own rules (WCAG 2.0–2.2 A/AA and its best practices), run in the page as it stands. Only
// "serious" and "critical" findings fail a test (issue 13 item 11); "moderate" and "minor" ones are
// advice. Call it once the page shows its main content, so axe sees what a person sees.

/** One line per serious or critical violation: rule id, impact, and the selectors of the offending nodes. */
export async function seriousA11yViolations(page: Page, options: { exclude?: string[] } = {}): Promise<string[]> {
  // Next streams a dynamic page's metadata after its body: wait for the <title> so axe does not judge a
  // page that is still arriving (the document-title rule failed that way once, depending on timing).
  await page.waitForFunction(() => document.title.trim().length > 0, undefined, { timeout: 10_000 });
  // Legacy mode runs axe inside the page itself: the default opens a second page in the page's context to
  // combine frame results, which fails for pages made with browser.newPage() (and our pages have no frames).
  const analyze = () => {
    let builder = new AxeBuilder({ page }).setLegacyMode(true);
    for (const selector of options.exclude ?? []) builder = builder.exclude(selector);
    return builder.analyze();
  };
  let results = await analyze();
  // A router.refresh() re-streams the page's head: axe can run in the moment the old <title> is gone and
  // the new one not yet in. Judge the page once the refresh has settled; a title that is really missing
  // still fails the second run.
  if (results.violations.some((v) => v.id === 'document-title')) {
    await page.waitForLoadState('networkidle');
    await page.waitForFunction(() => document.title.trim().length > 0, undefined, { timeout: 10_000 });
    results = await analyze();
  }
  return results.violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => {
      const nodes = violation.nodes.map((node) => node.target.map(String).join(' >>> '));
      return `${violation.id} (${violation.impact}) on ${new URL(page.url()).pathname}: ${violation.help} — ${nodes.join(', ')}`;
    });
}

/** Fails the test, listing each serious or critical violation, when axe finds any on the page now. */
export async function expectNoSeriousA11yViolations(page: Page, options: { exclude?: string[] } = {}): Promise<void> {
  expect(await seriousA11yViolations(page, options)).toEqual([]);
}
