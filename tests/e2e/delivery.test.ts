import type { CDPSession, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { useBrowserSession } from './support/session';

/*
 * How the built client reaches the browser: each page fetches its own code,
 * compressed, kept by the browser once fetched, and a page whose code cannot
 * be fetched says so inside the shell.
 */

const { app, pageAs, signIn, shot } = useBrowserSession('delivery');

interface Fetched {
  path: string;
  encoding: string | undefined;
  /** Bytes that crossed the network for it, headers included; 0 when the browser's cache answered. */
  bytes: number;
}

/** A page with a log of the JavaScript it fetches (the DevTools protocol sees cache hits too). */
async function watchedPage(): Promise<{ page: Page; scripts: Fetched[] }> {
  const page = await pageAs(null);
  const cdp: CDPSession = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  const scripts: Fetched[] = [];
  const byId = new Map<string, Fetched>();
  cdp.on('Network.responseReceived', (e) => {
    const url = new URL(e.response.url);
    if (!url.pathname.endsWith('.js')) return;
    const headers = Object.fromEntries(Object.entries(e.response.headers).map(([k, v]) => [k.toLowerCase(), v]));
    const fetched = { path: url.pathname, encoding: headers['content-encoding'], bytes: 0 };
    byId.set(e.requestId, fetched);
    scripts.push(fetched);
  });
  cdp.on('Network.loadingFinished', (e) => {
    const fetched = byId.get(e.requestId);
    if (fetched) fetched.bytes = e.encodedDataLength;
  });
  return { page, scripts };
}

/** The chunks that must never come with the first page: the editor, the chart library, the engine's workers. */
const HEAVY = /editor-route|HistogramPlot|\.worker-/;

describe('the client is delivered in pieces', () => {
  it('sign-in fetches only its own code, brotli-compressed, and a reload takes it from the cache', async () => {
    const { page, scripts } = await watchedPage();
    await page.goto(`${app.baseUrl}/sign-in`);
    await page.getByRole('button', { name: /sign in/i }).waitFor();
    expect(scripts.length).toBeGreaterThan(0);
    expect(scripts.filter((s) => HEAVY.test(s.path))).toEqual([]);
    // The build compresses every file from 1 kB (vite.config.ts); a smaller one gains nothing and comes as it is.
    const plain = scripts.filter((s) => s.encoding !== 'br');
    const plainSizes = await Promise.all(
      plain.map(async (s) => ({ path: s.path, size: (await (await fetch(app.baseUrl + s.path, { headers: { 'accept-encoding': 'identity' } })).arrayBuffer()).byteLength })),
    );
    expect(plainSizes.filter((s) => s.size >= 1024)).toEqual([]);
    await shot(page, 'sign-in');

    scripts.length = 0;
    await page.reload();
    await page.getByRole('button', { name: /sign in/i }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(scripts.length).toBeGreaterThan(0);
    expect(scripts.filter((s) => s.bytes > 0)).toEqual([]);
  });

  it('the list fetches the editor ahead; a new budget opens it without the chart library and the engine worker computes its result', async () => {
    const { page, scripts } = await watchedPage();
    const editorFetched = page.waitForRequest(/editor-route-[^/]*\.js$/);
    await signIn(page, 'metrologist@dubito.example');
    // The list fetches the editor's code while idle, before any budget is opened.
    await editorFetched;
    expect(page.url()).toMatch(/\/budgets$/);
    await page.goto(`${app.baseUrl}/budgets/new`);
    await page.getByText('No Monte Carlo result yet').waitFor();
    // The live recompute runs in a Web Worker served like any chunk: the result card's certificate
    // statement, drawn only from a computed GUM result, proves it arrived and ran.
    await page.getByRole('region', { name: 'Result' }).getByTestId('card-statement').waitFor();
    expect(scripts.some((s) => s.path.includes('editor-route'))).toBe(true);
    expect(scripts.filter((s) => s.path.includes('HistogramPlot'))).toEqual([]);
    await shot(page, 'new-budget');
  });

  it('a page whose code cannot be fetched offers a reload inside the shell', async () => {
    const { page } = await watchedPage();
    // As after an update: the tab asks for a chunk the server no longer has.
    await page.route(/editor-route-[^/]*\.js$/, (route) => route.fulfill({ status: 404, body: 'Not found' }));
    await signIn(page, 'metrologist@dubito.example');
    await page.getByRole('heading', { name: 'Budgets' }).waitFor();
    await page.locator('a[href^="/budgets/"]').first().click();
    await page.getByRole('alert').filter({ hasText: 'This page could not be loaded' }).waitFor();
    expect(await page.getByRole('button', { name: 'Reload' }).isVisible()).toBe(true);
    expect(await page.getByRole('button', { name: /sign out/i }).isVisible()).toBe(true);
    await shot(page, 'page-not-loaded');
  });
});
