import { describe, expect, it } from 'vitest';
import { countIs, hasTexts, shows } from './support/page-expect';
import { useBrowserSession } from './support/session';

/*
 * The lists the server pages and sorts, in Chromium against the built client and the demo lab:
 * a header click asks the server for another order and says so in aria-sort and the address,
 * the Columns menu hides a column, the search box narrows the budgets and the users as typed. Screenshots go to
 * tests/.artifacts/screenshots.
 */

const { app, pageAs, shot, checkAccessibility } = useBrowserSession('lists');

describe('lists sorted and paged by the server', () => {
  it('sorts the budgets by title on the server, marks the sorted column, and hides a column', async () => {
    const page = await pageAs('admin@dubito.example');
    await page.goto(`${app.baseUrl}/budgets`);
    const table = page.getByRole('table', { name: /Budgets, sorted by/ });
    await shows(table);
    const titleHeader = table.getByRole('columnheader', { name: /Title/ });
    expect(await titleHeader.getAttribute('aria-sort')).toBe('none');
    await titleHeader.getByRole('button').click();
    await expect.poll(() => titleHeader.getAttribute('aria-sort')).toBe('ascending');
    await page.waitForURL(/sort=title/);
    // the rows of the page are the first titles of the whole list, as the server sorted it
    const expected = await page.evaluate(async () => ((await (await fetch('/api/budgets?sort=title&order=asc&limit=12')).json()) as { title: string }[]).map((b) => b.title));
    await expect.poll(async () => (await table.locator('tbody tr td:first-child').allInnerTexts()).map((t) => t.trim())).toEqual(expected);

    await page.getByText('Columns', { exact: true }).click();
    await page.getByRole('checkbox', { name: 'Owner' }).uncheck();
    await countIs(table.getByRole('columnheader', { name: 'Owner' }), 0);
    await shot(page, 'budgets-by-title');
  }, 120_000);

  it('searches the budget titles as typed, and Clear filters or the Budgets link empties the search', async () => {
    const page = await pageAs('admin@dubito.example');
    await page.goto(`${app.baseUrl}/budgets`);
    const table = page.getByRole('table', { name: /Budgets, sorted by/ });
    const titles = table.locator('tbody tr td:first-child');
    await shows(table);
    const all = (await titles.allInnerTexts()).map((t) => t.trim());
    const box = page.getByLabel('Search titles');
    // typed key by key: the space between the words stays in the box while the address holds the trimmed text
    await box.pressSequentially('resistor ');
    await page.waitForURL(/q=resistor(&|$)/);
    expect(await box.inputValue()).toBe('resistor ');
    await box.pressSequentially('kf');
    await page.waitForURL(/q=resistor\+kf(&|$)/);
    expect(await box.inputValue()).toBe('resistor kf');
    const found = await page.evaluate(async () => ((await (await fetch('/api/budgets?q=resistor%20kf')).json()) as { title: string }[]).map((b) => b.title));
    expect(found.length).toBeGreaterThan(0);
    expect(found.length).toBeLessThan(all.length);
    await hasTexts(titles, found);
    await shot(page, 'budgets-searched');

    await page.getByRole('button', { name: 'Clear filters' }).click();
    await expect.poll(() => box.inputValue()).toBe('');
    expect(new URL(page.url()).search).toBe('');
    await hasTexts(titles, all);
    expect(await page.getByRole('button', { name: 'Clear filters' }).isDisabled()).toBe(true);

    await box.fill('gauge');
    await page.waitForURL(/q=gauge/);
    const gauges = await page.evaluate(async () => ((await (await fetch('/api/budgets?q=gauge')).json()) as { title: string }[]).map((b) => b.title));
    expect(gauges.length).toBeGreaterThan(0);
    await hasTexts(titles, gauges);
    await checkAccessibility(page, 'the budgets searched for gauge');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Budgets' }).click();
    await expect.poll(() => box.inputValue()).toBe('');
    await hasTexts(titles, all);
  }, 120_000);

  it('filters the users by name on the server and sorts them by e-mail', async () => {
    const page = await pageAs('admin@dubito.example');
    await page.goto(`${app.baseUrl}/admin/users`);
    await shows(page.getByTestId('user-trainee@dubito.example'));
    await page.getByLabel('Search names and addresses').fill('castell');
    await page.waitForURL(/q=castell/);
    await countIs(page.getByTestId('user-admin@dubito.example'), 0);
    await shows(page.getByTestId('user-trainee@dubito.example'));
    await page.getByRole('button', { name: 'Clear filters' }).click();
    const emailHeader = page.getByRole('columnheader', { name: /E-mail/ });
    await emailHeader.getByRole('button').click();
    await expect.poll(() => emailHeader.getAttribute('aria-sort')).toBe('ascending');
    await expect.poll(async () => (await page.locator('tbody tr').first().getAttribute('data-testid')) ?? '').toBe('user-admin@dubito.example');
    await shot(page, 'users-by-email');
  }, 120_000);

  it('shows a budget’s versions newest first and the oldest first after a click', async () => {
    const page = await pageAs('auditor@dubito.example');
    await page.goto(`${app.baseUrl}/budgets`);
    await page
      .getByRole('link', { name: /Resistor KF-R10K-7/ })
      .first()
      .click();
    await page.waitForURL(/\/budgets\/\d+$/);
    const id = Number(/\/budgets\/(\d+)/.exec(page.url())?.[1]);
    await page.goto(`${app.baseUrl}/budgets/${id}/versions`);
    const table = page.getByRole('table', { name: /Versions of the budget/ });
    const firstCell = table.locator('tbody tr td:first-child').first();
    await expect.poll(() => firstCell.innerText()).toBe('v3');
    await table
      .getByRole('columnheader', { name: /Version/ })
      .getByRole('button')
      .click();
    await expect.poll(() => firstCell.innerText()).toBe('v1');
    await page.waitForURL(/order=asc/);
    await shot(page, 'versions-oldest-first');
  }, 120_000);
});
