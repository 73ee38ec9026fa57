/*
 * Page-load benchmark (part of npm run bench; alone: npm run bench:pages).
 * The built server as `npm start` runs it (the client built into dist/ first
 * when that is stale) on a loopback port with the demo lab, and Debian's
 * Chromium through playwright-core. Each page is opened RUNS times in a fresh
 * browser context (cold: nothing cached) and once more in that context (warm:
 * its code from the browser's cache, as on every later visit), and timed
 * from the start of navigation (the page's performance time origin) to the
 * first animation frame in which it can be used: sign-in with its form and an
 * enabled button, the budget list with its rows, the editor with the model,
 * the budget table and the stored result. Prints the medians with
 * PASS/MISS against "well under a second" (≤ 500 ms); never fails for a MISS.
 * Needs /usr/bin/chromium; without it the figures are skipped.
 */
import type { ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../server/demo-seed';
import { freePort, median, startBuiltServer, verdict } from './support';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const CHROMIUM = '/usr/bin/chromium';
const RUNS = Number(process.env.BENCH_PAGE_RUNS ?? 7);
const TARGET_MS = 500;

/**
 * Resolves with the page's own clock (ms since navigation began) at the first frame in which the
 * JavaScript expression `ready` is true (page code, written as text: this project has no DOM types).
 */
async function usableAt(page: Page, ready: string): Promise<number> {
  const handle = await page.waitForFunction(`(${ready}) && performance.now()`, null, { polling: 'raf', timeout: 30_000 });
  return (await handle.jsonValue()) as number;
}

const SETTLED = `!document.querySelector('[aria-busy="true"]')`;
const PAGES: { name: string; path: string; signedIn: boolean; ready: string }[] = [
  {
    name: 'sign-in',
    path: '/sign-in',
    signedIn: false,
    ready: `[...document.querySelectorAll('button')].some((b) => /^\\s*sign in\\s*$/i.test(b.textContent) && !b.disabled) && !!document.querySelector('input[type="email"]')`,
  },
  {
    name: 'budget list',
    path: '/budgets',
    signedIn: true,
    ready: `document.querySelectorAll('main table tbody tr').length > 0 && ${SETTLED}`,
  },
  {
    name: 'editor (stored budget)',
    path: '/budgets/BUDGET',
    signedIn: true,
    ready:
      `[...document.querySelectorAll('h2')].some((h) => h.textContent.includes('Uncertainty budget')) && !!document.querySelector('textarea') && ` +
      `document.querySelectorAll('table tbody tr').length > 0 && ${SETTLED}`,
  },
];

/** Signs the context's browser in as the demo metrologist (its cookie then goes with every page of the context). */
async function signInAsMetrologist(context: BrowserContext, base: string): Promise<void> {
  const login = await context.request.post(`${base}/api/auth/login`, { data: { email: 'metrologist@dubito.example', password: DEMO_PASSWORD }, headers: { origin: base } });
  if (!login.ok()) throw new Error(`demo sign-in failed: ${login.status()}`);
}

/** The page opened in a fresh context (cold: nothing cached), then again in the same one (warm: code from the browser's cache). */
async function openTwice(browser: Browser, base: string, path: string, signedIn: boolean, ready: string): Promise<{ cold: number; warm: number }> {
  const context = await browser.newContext();
  try {
    if (signedIn) await signInAsMetrologist(context, base);
    const open = async () => {
      const page = await context.newPage();
      await page.goto(`${base}${path}`, { waitUntil: 'commit' });
      const at = await usableAt(page, ready);
      await page.close();
      return at;
    };
    const cold = await open();
    return { cold, warm: await open() };
  } finally {
    await context.close();
  }
}

if (!existsSync(CHROMIUM)) {
  console.log(`\nPage load: ${CHROMIUM} not found (apt-get install chromium): skipped`);
} else {
  const dir = mkdtempSync(join(tmpdir(), 'dubito-page-load-'));
  let server: ChildProcess | undefined;
  let browser: Browser | undefined;
  try {
    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    server = await startBuiltServer(ROOT, { DUBITO_DB: join(dir, 'dubito.sqlite'), PORT: String(port), HOST: '127.0.0.1', DUBITO_DEMO: '1', DUBITO_COOKIE_SECURE: '0' });
    browser = await chromium.launch({ executablePath: CHROMIUM, headless: true });
    // A budget of the demo lab with a stored result.
    const list = await (async () => {
      const context = await browser!.newContext();
      await signInAsMetrologist(context, base);
      const rows = (await (await context.request.get(`${base}/api/budgets`, { headers: { origin: base } })).json()) as { id: number }[];
      await context.close();
      return rows;
    })();
    const budget = list[0]?.id;
    if (budget === undefined) throw new Error('the demo lab has no budget');

    console.log(
      `\nPage load on loopback: navigation start to usable, median of ${RUNS} runs after one warm-up; cold: a fresh browser context ` +
        `(nothing cached), warm: the same page opened again in it (code from the browser's cache, as on every later visit)\n`,
    );
    console.log(`${'page'.padEnd(26)}${'cold ms'.padStart(9)}${'warm ms'.padStart(9)}   target (both medians)`);
    for (const p of PAGES) {
      const path = p.path.replace('BUDGET', String(budget));
      await openTwice(browser, base, path, p.signedIn, p.ready); // the server's and the disk's caches, as a lab's second visitor finds them
      const runs: { cold: number; warm: number }[] = [];
      for (let i = 0; i < RUNS; i++) runs.push(await openTwice(browser, base, path, p.signedIn, p.ready));
      const cold = median(runs.map((r) => r.cold));
      const warm = median(runs.map((r) => r.warm));
      console.log(`${p.name.padEnd(26)}${cold.toFixed(0).padStart(9)}${warm.toFixed(0).padStart(9)}   ≤ ${TARGET_MS} ms  ${verdict(cold <= TARGET_MS && warm <= TARGET_MS)}`);
    }
  } finally {
    await browser?.close();
    server?.kill('SIGTERM');
    rmSync(dir, { recursive: true, force: true });
  }
}
