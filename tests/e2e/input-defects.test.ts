import type { Locator, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { containsText, countIs, hasTexts, shows } from './support/page-expect';
import { useBrowserSession } from './support/session';

/*
 * Pasted observations with a decimal comma, the lines the reader ignored,
 * removing an input and undoing it, an old version's own status, and a
 * read-only budget shown as text: in Debian's Chromium against the built
 * client and the server with the demo lab.
 */

const { app, pageAs, shot } = useBrowserSession('input-defects');

const inputItems = (page: Page): Locator => page.getByRole('list', { name: 'Input quantities' }).getByRole('listitem');

/** The value a definition list gives for a term. */
const definition = (scope: Locator, term: string): Locator => scope.locator(`dt:text-is("${term}") + dd`);

/** A status badge: its mark, then its word. */
const badge = (scope: Page | Locator, word: string): Locator => scope.getByText(new RegExp(`^[✓○◐↩⊘]\\s*${word}$`));

async function inputOrder(page: Page): Promise<string[]> {
  const labels = await page.getByRole('button', { name: /^Move / }).evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
  return labels.map((n) => /^Move (\S+)/.exec(n)?.[1] ?? n);
}

/** The input row whose header has the keyboard focus. */
const focusedRow = (page: Page) => page.evaluate(() => (document.activeElement?.hasAttribute('aria-expanded') ? (document.activeElement.closest('li')?.getAttribute('data-input') ?? null) : null));

/** The id of the demo budget that went through review: three versions, the third approved. */
async function resistorBudget(page: Page): Promise<number> {
  return page.evaluate(async () => {
    const list = (await (await fetch('/api/budgets?q=Resistor')).json()) as { id: number; title: string }[] | { items: { id: number; title: string }[] };
    const rows = Array.isArray(list) ? list : list.items;
    return rows.find((b) => /Resistor KF-R10K-7/.test(b.title))!.id;
  });
}

describe('input defects: pasted readings, undo, version status, read-only text', () => {
  it('reads decimal-comma readings, lists the ignored lines, and undoes the removal of an input', async () => {
    const page = await pageAs('metrologist@dubito.example');
    await page.goto(`${app.baseUrl}/budgets/new`);
    const item = inputItems(page).first();
    await shows(item.getByLabel('Symbol'));
    await item.getByLabel('Symbol').fill('t_i');
    await item.getByLabel('Distribution').selectOption({ label: 'Repeated observations (Type A)' });

    // twenty readings 50,00 … 50,04 (each four times, mean 50,02) under a heading, with one unreadable line
    const readings = Array.from({ length: 20 }, (_, i) => `50,0${i % 5}`);
    await item.getByLabel(/^Observations/).fill(['Reading (mm)', ...readings.slice(0, 2), 'n/a', ...readings.slice(2)].join('\n'));
    await hasTexts(definition(item, 'n'), ['20']);
    await containsText(definition(item, 'mean q̄'), /^50\.020/);
    await hasTexts(item.getByRole('list', { name: 'Lines not read' }).getByRole('listitem'), ['line 1: "Reading (mm)" is not a number (read as a heading)', 'line 4: "n/a" is not a number']);
    await shot(page, 'pasted-decimal-comma');

    // remove the input with its readings, then undo: it comes back first, readings and all
    await expect.poll(() => inputOrder(page)).toEqual(['t_i', 'x2']);
    await page.getByRole('button', { name: 'Remove t_i' }).focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => inputOrder(page)).toEqual(['x2']);
    // the keyboard lands on the row that took its place, not on the page
    await expect.poll(() => focusedRow(page)).toBe('x2');
    const toast = page.getByRole('status').filter({ hasText: 'Removed input t_i with its 20 observations.' });
    await shows(toast);
    await shot(page, 'removed-with-undo');
    await toast.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => inputOrder(page)).toEqual(['t_i', 'x2']);
    await expect.poll(() => focusedRow(page)).toBe('t_i');
    await hasTexts(definition(inputItems(page).first(), 'n'), ['20']);
  }, 180_000);

  it('compares U like with like: a change of the measurand unit is not reported as a change of U', async () => {
    const page = await pageAs('metrologist@dubito.example');
    await page.goto(`${app.baseUrl}/budgets/new`);
    const measurand = page.getByRole('region', { name: 'Measurand' });
    const result = page.getByRole('region', { name: 'Result' });
    const first = inputItems(page).first();
    await first.getByLabel('Unit').fill('mm');
    const second = inputItems(page).nth(1);
    await second.getByRole('button', { expanded: false }).click();
    await second.getByLabel('Unit').fill('mm');
    await measurand.getByLabel('Unit').fill('mm');
    await containsText(result.getByRole('button', { name: /^U / }), 'mm');

    // a real change of U is reported…
    await first.getByLabel('Standard uncertainty u').fill('0.02');
    await containsText(result, /Your last edit raised U by/);
    // …the same U in micrometres is not
    await measurand.getByLabel('Unit').fill('um');
    await containsText(result.getByRole('button', { name: /^U / }), 'µm');
    await countIs(result.getByText(/Your last edit/), 0);
    await shot(page, 'unit-change');
  }, 180_000);

  it('shows an old unapproved version of an approved budget as superseded, everywhere it appears', async () => {
    const page = await pageAs('metrologist@dubito.example');
    await page.goto(`${app.baseUrl}/budgets`);
    const id = await resistorBudget(page);

    await page.goto(`${app.baseUrl}/budgets/${id}/versions`);
    const rows = page.getByRole('table').getByRole('row');
    await shows(badge(rows.filter({ hasText: 'v3' }), 'Approved'));
    await shows(badge(rows.filter({ hasText: 'v1' }), 'Superseded draft'));
    await countIs(badge(rows.filter({ hasText: 'v1' }), 'Approved'), 0);
    await shot(page, 'versions-list');

    await page.goto(`${app.baseUrl}/budgets/${id}/versions/1`);
    const header = page.locator('header').filter({ hasText: 'v1 of 3' });
    await shows(badge(header, 'Superseded draft'));
    await countIs(badge(header, 'Approved'), 0);
    await shot(page, 'old-version');

    await page.goto(`${app.baseUrl}/budgets/${id}/compare?from=1&to=3`);
    await shows(page.getByTestId('comparison'));
    await shows(badge(page, 'Superseded draft'));
    await shows(badge(page, 'Approved'));
    await shot(page, 'compare-status');

    await page.goto(`${app.baseUrl}/budgets/${id}/versions/1/report`);
    await shows(badge(page, 'Superseded draft'));
    await countIs(badge(page, 'Approved'), 0);
    await shot(page, 'old-version-report');
  }, 180_000);

  it('renders a budget the auditor may only read as text, not as locked fields', async () => {
    const page = await pageAs('auditor@dubito.example');
    const id = await resistorBudget(page);
    await page.goto(`${app.baseUrl}/budgets/${id}`);
    await shows(page.getByRole('heading', { level: 1, name: /Resistor KF-R10K-7/ }));
    await countIs(page.getByRole('textbox', { name: 'Title' }), 0);

    const measurand = page.getByRole('region', { name: 'Measurand' });
    await hasTexts(definition(measurand, 'Symbol'), ['R_x']);
    await hasTexts(definition(measurand, 'Unit'), ['Ω']);
    const model = page.getByRole('region', { name: 'Model' });
    await containsText(definition(model, 'Model equation(s)'), 'R_x = (R_s + dR_drift + dR_T) * r');

    const first = inputItems(page).first();
    await first.getByRole('button', { expanded: false }).click();
    await hasTexts(definition(first, 'Value (Ω)'), ['10000.053']);
    await hasTexts(definition(first, 'Expanded uncertainty U (Ω)'), ['0.004']);
    const ratio = inputItems(page).nth(1);
    await ratio.getByRole('button', { expanded: false }).click();
    await countIs(ratio.getByRole('list', { name: 'Observations' }).getByRole('listitem'), 5);

    // no form control in the budget's sections: the keyboard goes from one action to the next
    for (const name of ['Measurand', 'Model', /^Input quantities/, 'Constants', 'Correlations', 'Monte Carlo method']) {
      await countIs(page.getByRole('region', { name }).locator('input, textarea, select'), 0);
    }
    // the Monte Carlo settings are the budget's, as text; a run here reproduces the stored one
    const mc = page.getByRole('region', { name: 'Monte Carlo method' });
    await containsText(definition(mc, 'Trials M'), /^100\s000$/);
    await hasTexts(definition(mc, 'Seed'), ['kestrel-r10k']);
    await shows(mc.getByRole('button', { name: 'Run Monte Carlo' }));
    await shot(mc, 'read-only-monte-carlo');
    await shot(page, 'read-only');

    // constants and correlations of a budget the auditor reads are table cells
    const dc = await page.evaluate(async () => ((await (await fetch('/api/budgets?q=DC%20voltage')).json()) as { id: number }[])[0].id);
    await page.goto(`${app.baseUrl}/budgets/${dc}`);
    const correlations = page.getByRole('region', { name: 'Correlations' });
    await shows(correlations.getByRole('table', { name: 'Correlation coefficients between inputs' }));
    await countIs(correlations.locator('input, select'), 0);
    await shot(page, 'read-only-correlations');

    // the report prints the correlation matrix, each header cell named
    await page.goto(`${app.baseUrl}/budgets/${dc}/versions/1/report`);
    await shows(page.getByTestId('report-correlations'));
    await shot(page, 'report-correlations');
  }, 180_000);
});
