import type { BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll } from 'vitest';
import { expectAccessible } from './accessibility';
import { screenshotPath, startApp, type AppUnderTest } from './app-under-test';
import { openBrowser } from './browser';
import { shows } from './page-expect';

export interface BrowserSession {
  /** The app under test; its address is known once the file's beforeAll has run. */
  app: { readonly baseUrl: string };
  /** A page in a browser of its own, signed in as `email` (or signed out for null). */
  pageAs(email: string | null): Promise<Page>;
  /** Signs in through the sign-in page, as a person would, checking it and the page it lands on. */
  signIn(page: Page, email: string, password?: string): Promise<void>;
  /** Checks the page (or the element's page) for accessibility, then takes a screenshot of it (or of the element). */
  shot(target: Page | Locator, name: string): Promise<void>;
  /** Checks the page as it stands, for states no screenshot shows (an open dialog, a page left by a click). */
  checkAccessibility(page: Page, what: string): Promise<void>;
}

/** A route as a pattern: ids and version numbers do not make another page. */
const routeOf = (url: string) => new URL(url).pathname.replace(/\/\d+(?=\/|$)/g, '/:n');

/**
 * The app and its browsers for one test file: starts the app before the file's
 * tests, closes each test's browsers after it and stops the app at the end.
 *
 * Every page a journey shows is checked with axe-core, and any violation fails
 * the journey: at each screenshot, on the sign-in page and the page it lands
 * on, before a `goto` or `reload` leaves a page not checked since it was
 * reached, and at the end of each test for the pages it leaves open. A page
 * left by a click is checked by a screenshot or `checkAccessibility` before the
 * click; at the end of the file, a route that was visited but never checked
 * fails the file with its name.
 */
export function useBrowserSession(screenshots: string): BrowserSession {
  let started: AppUnderTest | undefined;
  let contexts: BrowserContext[] = [];
  const unchecked = new Set<Page>();
  const visited = new Set<string>();
  const checked = new Set<string>();
  let allPassed = true;

  const app = {
    get baseUrl(): string {
      if (!started) throw new Error('the app is not started yet: use the session inside a test');
      return started.baseUrl;
    },
  };

  async function checkAccessibility(page: Page, what: string): Promise<void> {
    if (page.url() === 'about:blank') return;
    unchecked.delete(page);
    await expectAccessible(page, what);
    checked.add(routeOf(page.url()));
  }

  /** Checks a page not checked since it was reached, in the state the test last waited for. */
  async function checkIfUnchecked(page: Page, when: string): Promise<void> {
    if (unchecked.has(page)) await checkAccessibility(page, `the page left ${when}`);
  }

  function watch(page: Page): void {
    page.on('framenavigated', (frame) => {
      if (frame !== page.mainFrame() || frame.url() === 'about:blank') return;
      unchecked.add(page);
      visited.add(routeOf(frame.url()));
    });
    const goto = page.goto.bind(page);
    page.goto = async (...args: Parameters<Page['goto']>) => {
      await checkIfUnchecked(page, `for ${args[0]}`);
      return goto(...args);
    };
    const reload = page.reload.bind(page);
    page.reload = async (...args: Parameters<Page['reload']>) => {
      await checkIfUnchecked(page, 'by a reload');
      return reload(...args);
    };
  }

  async function signIn(page: Page, email: string, password = 'dubito-demo'): Promise<void> {
    await page.goto(`${app.baseUrl}/sign-in`);
    const submit = page.getByRole('button', { name: /sign in/i });
    await shows(submit);
    await checkAccessibility(page, 'sign-in');
    await page.getByLabel(/e-?mail/i).fill(email);
    await page.getByLabel(/password/i).fill(password);
    await submit.click();
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    await checkAccessibility(page, `the first page of ${email}`);
  }

  async function pageAs(email: string | null): Promise<Page> {
    const context = await openBrowser();
    contexts.push(context);
    const page = await context.newPage();
    page.setDefaultTimeout(20_000);
    watch(page);
    if (email) await signIn(page, email);
    return page;
  }

  async function shot(target: Page | Locator, name: string): Promise<void> {
    const page = 'mainFrame' in target ? target : target.page();
    await checkAccessibility(page, `screenshot ${screenshots}-${name}`);
    await target.screenshot({ path: screenshotPath(screenshots, name), ...('mainFrame' in target ? { fullPage: true } : {}) });
  }

  beforeAll(async () => {
    started = await startApp();
  }, 180_000);

  afterEach(async (test) => {
    const open = contexts;
    contexts = [];
    const failed = test.task.result?.state === 'fail';
    allPassed &&= !failed;
    try {
      // A failed test's pages are left as they failed: their state is not a screen of the product.
      if (!failed) for (const page of [...unchecked]) await checkAccessibility(page, 'the end of the test');
    } finally {
      unchecked.clear();
      await Promise.all(open.map((c) => c.close()));
    }
  }, 60_000);

  afterAll(async () => {
    await Promise.all(contexts.map((c) => c.close()));
    await started?.stop();
    const never = [...visited].filter((r) => !checked.has(r));
    // After a failure the routes a test did not reach say nothing.
    if (allPassed && never.length) throw new Error(`visited but never checked for accessibility: ${never.join(', ')} (take a screenshot or call checkAccessibility while each shows its content)`);
  });

  return { app, pageAs, signIn, shot, checkAccessibility };
}
