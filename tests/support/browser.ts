import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { signIn, type TestRole } from './auth';
import { readRuntime } from './runtime';

// Debian's chromium, never a downloaded browser. The flags keep it off the (closed) network.
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
}

/** A browser context signed in as a member of staff: the session cookie of `signIn(role)`, desktop size by default. */
export async function staffContext(
  browser: Browser,
  role: TestRole,
  viewport = { width: 1280, height: 900 },
): Promise<BrowserContext> {
  const [name, value] = (await signIn(role)).split('=');
  const context = await browser.newContext({ viewport });
  await context.addCookies([{ name, value, url: readRuntime().appUrl }]);
  return context;
}

/** A page that collects its uncaught script errors in `errors` (tests expect none) and waits `timeoutMs` at most. */
export async function watchedPage(context: BrowserContext, errors: string[], timeoutMs = 10_000): Promise<Page> {
  const page = await context.newPage();
  page.setDefaultTimeout(timeoutMs);
  page.on('pageerror', (error) => errors.push(error.message));
  return page;
}
