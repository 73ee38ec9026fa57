import { writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { containsText, countIs, hasTexts, shows } from './support/page-expect';
import { useBrowserSession } from './support/session';

/*
 * The five user journeys of Dubito, in Debian's Chromium against the built
 * client and the real server on a fresh database with the demo lab.
 * Screenshots of the main screens go to tests/.artifacts/screenshots.
 */

const { app, pageAs, shot, checkAccessibility } = useBrowserSession('journey');

function inputItems(page: Page): Locator {
  return page.getByRole('list', { name: 'Input quantities' }).getByRole('listitem');
}

/** Opens an input's form (if closed) and returns its list item. */
async function openInput(page: Page, index: number): Promise<Locator> {
  const item = inputItems(page).nth(index);
  // The item's header is its first button that says whether it is expanded; after a load it must be there before its state is read.
  const header = item.locator('button[aria-expanded]').first();
  await shows(header);
  if ((await header.getAttribute('aria-expanded')) === 'false') await header.click();
  await shows(item.getByLabel('Symbol'));
  return item;
}

/** Symbols as the budget table typesets them: the part after _ becomes a subscript. */
const typeset = (symbols: string[]) => symbols.map((s) => s.replace('_', ''));

async function inputOrder(page: Page): Promise<string[]> {
  const handles = await page.getByRole('button', { name: /^Move / }).allTextContents();
  const names = await page.getByRole('button', { name: /^Move / }).evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
  return (names.length ? names : handles).map((n) => /^Move (\S+)/.exec(n)?.[1] ?? n);
}

describe('journey 1: a metrologist drafts a budget from scratch', () => {
  it('writes the model, four inputs of different kinds (one from a CSV file), reorders them, runs Monte Carlo and saves', async () => {
    const page = await pageAs('metrologist@dubito.example');
    await page
      .getByRole('button', { name: 'New budget' })
      .or(page.getByRole('link', { name: 'New budget' }))
      .first()
      .click();
    await page.waitForURL(/\/budgets\/new/);

    await page.getByRole('textbox', { name: 'Title' }).fill('Standard resistor 100 Ω on bench KF-E4');
    const measurand = page.getByRole('region', { name: 'Measurand' });
    await measurand.getByLabel('Symbol').fill('R');
    await measurand.getByLabel('Unit').fill('ohm');

    // 1: reference from its certificate, U and k
    let item = await openInput(page, 0);
    await item.getByLabel('Symbol').fill('R_s');
    await item.getByLabel('Unit').fill('ohm');
    await item.getByLabel('Given as').selectOption({ index: 1 });
    await item.getByLabel('Value').fill('100.00012');
    await item.getByLabel('Expanded uncertainty U').fill('0.00004');
    await item.getByLabel('Coverage factor k').fill('2');
    // a certificate is recorded as such; its number goes with it
    await item.getByLabel('Source').fill('certificate KF-0423');

    // 2: observations uploaded as a CSV file
    item = await openInput(page, 1);
    await item.getByLabel('Symbol').fill('dR_obs');
    await item.getByLabel('Unit').fill('ohm');
    await item.getByLabel('Distribution').selectOption({ label: 'Repeated observations (Type A)' });
    const csv = join(tmpdir(), `dubito-e2e-observations-${process.pid}.csv`);
    writeFileSync(csv, 'reading,deviation\n1,0.0000121\n2,0.0000098\n3,0.0000113\n4,0.0000105\n5,0.0000117\n6,0.0000109\n');
    const chooser = page.waitForEvent('filechooser');
    await item.getByRole('button', { name: 'Upload CSV…' }).click();
    await (await chooser).setFiles(csv);
    // the file has two columns: the editor asks which one holds the observations
    const columnPicker = item.getByLabel(/has several columns: choose one/);
    await shows(columnPicker);
    await columnPicker.selectOption({ label: 'deviation' });
    await hasTexts(item.getByRole('definition').first(), ['6']); // n = 6

    // 3: the resolution of the display, r = 10 µΩ, a rectangular distribution with a = r/2
    await page.getByRole('button', { name: '+ Add input quantity' }).click();
    item = await openInput(page, 2);
    await item.getByLabel('Symbol').fill('dR_res');
    await item.getByLabel('Unit').fill('ohm');
    await item.getByLabel('Distribution').selectOption({ label: 'Rectangular (uniform)' });
    await item.getByLabel('Given as').selectOption({ label: 'the resolution of an indicating instrument' });
    await item.getByLabel('Value').fill('0');
    await item.getByLabel('Resolution r').fill('0.00001');

    // 4: temperature effect as a triangular distribution
    await page.getByRole('button', { name: '+ Add input quantity' }).click();
    item = await openInput(page, 3);
    await item.getByLabel('Symbol').fill('dR_T');
    await item.getByLabel('Unit').fill('ohm');
    await item.getByLabel('Distribution').selectOption({ label: 'Triangular' });
    await item.getByLabel('Value').fill('0');
    await item.getByLabel('Half-width a').fill('0.00001');

    await page.getByRole('textbox', { name: /Model equation/ }).fill('R = R_s + dR_obs + dR_res + dR_T');

    const table = page.getByRole('table', { name: /Uncertainty budget/ });
    await hasTexts(table.getByTestId('budget-symbol'), typeset(['R_s', 'dR_obs', 'dR_res', 'dR_T']));
    const result = page.getByRole('region', { name: 'Result' });
    await containsText(result.getByRole('button', { name: /^R / }), '100.000');
    await shot(page, '1-budget-table');

    // reorder by keyboard drag: dR_T from position 4 to position 1
    const handle = page.getByRole('button', { name: /^Move dR_T/ });
    await handle.focus();
    // Each key waits for the drag's own announcement, so no key lands before the sensor has seen the last one.
    const dragNews = page.locator('[id^="DndLiveRegion"]');
    await page.keyboard.press('Space');
    await containsText(dragNews, 'dR_T is over position 4.');
    for (const position of [3, 2, 1]) {
      await page.keyboard.press('ArrowUp');
      await containsText(dragNews, `dR_T is over position ${position}.`);
    }
    await page.keyboard.press('Space');
    await expect.poll(() => inputOrder(page)).toEqual(['dR_T', 'R_s', 'dR_obs', 'dR_res']);
    await hasTexts(table.getByTestId('budget-symbol'), typeset(['dR_T', 'R_s', 'dR_obs', 'dR_res']));

    // Monte Carlo in the worker, histogram and verdict
    const mc = page.getByRole('region', { name: 'Monte Carlo method' });
    // a long run shows its progress and can be stopped; the page stays usable meanwhile
    expect(await page.evaluate(() => globalThis.crossOriginIsolated)).toBe(true);
    // the panel offers no more trials than a save stores, and says so before the run
    await shows(mc.getByText(/A saved version stores at most 1\s000\s000 trials/));
    await mc.getByLabel('Trials M').selectOption({ label: '1 000 000' });
    await mc.getByRole('button', { name: 'Run Monte Carlo' }).click();
    await shows(mc.getByRole('progressbar'));
    await mc.getByRole('button', { name: 'Cancel' }).click();
    await shows(mc.getByText(/Stopped after .* trials/));
    await mc.getByLabel('Trials M').selectOption({ label: '100 000' });
    await mc.getByRole('button', { name: 'Run Monte Carlo' }).click();
    await shows(mc.getByRole('table', { name: 'GUM and Monte Carlo results side by side' }), 60_000);
    // any verdict of JCGM 101:2008 8.2 that compares: at 10⁵ trials the numerical accuracy may be of the size of δ
    await shows(mc.getByTestId('mc-verdict').getByText(/GUM result is (validated|not validated)|comparison with the Monte Carlo method is inconclusive/));
    await shows(mc.locator('.js-plotly-plot, svg.main-svg'));
    await shot(page, '1-monte-carlo');
    const seenSeed = await mc.getByLabel('Seed').inputValue();

    await page.getByRole('button', { name: 'Save version…' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Change note').fill('First draft from the bench notes');
    await checkAccessibility(page, 'the save dialog');
    await dialog.getByRole('button', { name: 'Save version' }).click();
    await page.waitForURL(/\/budgets\/\d+/);
    await shows(page.getByText(/saved/i));
    await shot(page, '1-saved');

    const id = Number(/\/budgets\/(\d+)/.exec(page.url())?.[1]);
    const stored = await page.evaluate(async (budgetId) => (await fetch(`/api/budgets/${budgetId}`)).json(), id);
    expect(stored.document.inputs.map((q: { symbol: string }) => q.symbol)).toEqual(['dR_T', 'R_s', 'dR_obs', 'dR_res']);
    expect(stored.document.inputs[2].distribution.values).toHaveLength(6);
    // each input keeps how it was stated, and the form shows it so after a reload
    expect(stored.document.inputs[1].distribution.stated).toEqual({ as: 'certificate', source: 'certificate KF-0423' });
    expect(stored.document.inputs[3].distribution).toMatchObject({ kind: 'rectangular', halfWidth: 0.000005, stated: { as: 'resolution' } });
    await page.reload();
    await containsText(await openInput(page, 3), 'r = 0.00001 Ω (a = r/2); divisor 2√3');
    await containsText(await openInput(page, 1), 'U = 0.00004 Ω, k = 2; divisor 2');
    expect(stored.result.gum.estimate).toBeCloseTo(100.00012 + 0.000011, 6);
    // the stored run is the run that was seen: the panel's trials and seed (JCGM 101:2008 7.2)
    expect(stored.result.monteCarlo).toMatchObject({ trials: 100_000, seed: seenSeed });
  }, 180_000);
});

/** Opens a budget from the list by its title. */
async function openBudget(page: Page, title: RegExp): Promise<number> {
  await page.goto(`${app.baseUrl}/budgets`);
  await page.getByRole('link', { name: title }).first().click();
  await page.waitForURL(/\/budgets\/\d+$/);
  return Number(/\/budgets\/(\d+)/.exec(page.url())?.[1]);
}

async function saveVersion(page: Page, note: string): Promise<void> {
  await page.getByRole('button', { name: 'Save version…' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Change note').fill(note);
  await dialog.getByRole('button', { name: 'Save version' }).click();
  await shows(page.getByText(/saved/i));
}

describe('journey 2: review, return, resubmit and approve', () => {
  it('a reviewer comments on one contribution and returns the budget; after the change the reviewer signs it off', async () => {
    const title = /Conventional mass of a 200 g weight/;
    const author = await pageAs('metrologist@dubito.example');
    const id = await openBudget(author, title);
    await author.getByRole('button', { name: 'Submit for review' }).click();
    await shows(author.getByText('In review'));

    const reviewer = await pageAs('reviewer@dubito.example');
    await reviewer.goto(`${app.baseUrl}/budgets/${id}`);
    await reviewer.getByRole('button', { name: 'Comment on dm_r' }).click();
    await reviewer.getByLabel('New comment on dm_r').fill('The certificate KF-2025-077 gives U = 0.025 mg, not 0.030 mg. Please check.');
    await reviewer.getByRole('button', { name: 'Add comment' }).click();
    await shows(reviewer.getByRole('button', { name: '1 comment on dm_r' }));
    await shot(reviewer, '2-comment-on-contribution');

    await reviewer.getByRole('button', { name: 'Return to author' }).click();
    const back = reviewer.getByRole('dialog', { name: /Return version 1/ });
    await back.getByRole('button', { name: 'Send back' }).click();
    await shows(back.getByText(/required|give a reason|write/i)); // a return needs its comment
    await checkAccessibility(reviewer, 'the return dialog with its error');
    await back.getByLabel('Why is it returned?').fill('Uncertainty of the reference weight to be corrected, see the comment on dm_r.');
    await back.getByRole('button', { name: 'Send back' }).click();
    await shows(reviewer.getByText('Returned'));

    await author.goto(`${app.baseUrl}/budgets/${id}`);
    await shows(author.getByRole('button', { name: '1 comment on dm_r' }));
    const names = await author.getByRole('button', { name: /^Move / }).evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
    const index = names.findIndex((n) => n.startsWith('Move dm_r '));
    const item = await openInput(author, index);
    await item.getByLabel('Expanded uncertainty U').fill('0.025');
    await saveVersion(author, 'dm_r: U from certificate KF-2025-077 corrected to 0.025 mg');
    await author.getByRole('button', { name: 'Submit for review' }).click();
    // the dm_r thread and the return comment are still open: the submission lists them first
    const openThreads = author.getByRole('dialog', { name: /open comment thread/ });
    await shows(openThreads);
    await checkAccessibility(author, 'the open threads before a submission');
    await openThreads.getByRole('button', { name: 'Submit anyway' }).click();
    await shows(author.getByText('In review'));
    await shot(author, '2-resubmitted');

    await reviewer.goto(`${app.baseUrl}/budgets/${id}`);
    await reviewer.getByRole('button', { name: 'Approve' }).click();
    const sign = reviewer.getByRole('dialog', { name: /Approve version 2/ });
    await sign.getByLabel(/Why do you approve although/).fill('The return comment and the dm_r thread are answered by version 2.');
    await sign.getByLabel('Your password (signature)').fill('not my password');
    await sign.getByRole('button', { name: 'Sign and approve' }).click();
    await shows(sign.getByText(/password does not match/i));
    await checkAccessibility(reviewer, 'the approve dialog with a wrong password');
    await sign.getByLabel('Your password (signature)').fill('dubito-demo');
    await sign.getByRole('button', { name: 'Sign and approve' }).click();
    await shows(reviewer.getByText('Approved'));
    await shot(reviewer, '2-approved');

    // the approved version is read-only for everyone, its author included
    await author.goto(`${app.baseUrl}/budgets/${id}`);
    await shows(author.getByText('Approved'));
    await countIs(author.getByRole('button', { name: 'Save version…' }), 0);
    const value = author.getByRole('list', { name: 'Input quantities' }).getByRole('listitem').first();
    await value
      .getByRole('button', { expanded: false })
      .first()
      .click()
      .catch(() => undefined);
    const editable = await value
      .getByLabel('Value')
      .first()
      .isEditable()
      .catch(() => false);
    expect(editable).toBe(false);
    const stored = await author.evaluate(async (budgetId) => (await fetch(`/api/budgets/${budgetId}`)).json(), id);
    expect(stored.status).toBe('approved');
    expect(stored.approvedVersion).toBe(2);
    const dmR = stored.document.inputs.find((q: { symbol: string }) => q.symbol === 'dm_r');
    expect(dmR.distribution.U).toBe(0.025);

    // the report of the approved version: a print-ready page and its PDF
    await reviewer.goto(`${app.baseUrl}/budgets/${id}/versions/2/report`);
    await shows(reviewer.getByTestId('report-statement'));
    await shot(reviewer, '2-report');
    const href = await reviewer.getByRole('link', { name: 'Download PDF' }).getAttribute('href');
    const pdf = await reviewer.evaluate(async (url) => {
      const r = await fetch(url as string);
      return { type: r.headers.get('content-type'), head: new TextDecoder().decode((await r.arrayBuffer()).slice(0, 5)) };
    }, href);
    expect(pdf).toEqual({ type: 'application/pdf', head: '%PDF-' });
  }, 240_000);
});

describe('journey 3: an auditor compares versions and exports the audit trail', () => {
  it('compares version 1 with the latest, sees the changed input, and downloads the audit CSV', async () => {
    const page = await pageAs('auditor@dubito.example');
    const id = await openBudget(page, /Resistor KF-R10K-7/);
    await page.goto(`${app.baseUrl}/budgets/${id}/versions`);
    await shows(page.getByRole('table'));
    await checkAccessibility(page, 'the versions');
    const form = page
      .getByRole('form', { name: 'Compare two versions' })
      .or(page.getByRole('region', { name: 'Compare two versions' }))
      .first();
    await form.getByLabel('Compare version').selectOption('1');
    await form.getByLabel('with version').selectOption('3');
    await form.getByRole('button', { name: 'Compare' }).click();
    await page.waitForURL(/compare\?from=1&to=3/);
    // the input whose certificate changed is marked, field by field, and so is its contribution
    const changed = page.getByTestId('inputs-changed-R_s');
    await shows(changed);
    await shows(changed.locator('[data-change="changed"]'));
    await shows(changed.getByText(/changed/i));
    expect(await page.getByTestId('contribution-R_s').getAttribute('data-change')).toBe('changed');
    await shot(page, '3-compare');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /audit/i }).click();
    await shows(page.getByTestId('audit-table'));
    await shot(page, '3-audit-trail');
    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'Export CSV' }).click();
    const file = await (await download).path();
    const { readFileSync } = await import('node:fs');
    const csv = readFileSync(file, 'utf8');
    expect(csv.split('\n')[0]).toMatch(/time|at/i);
    expect(csv).toMatch(/budget\.approved|approved/);
  }, 180_000);
});

describe('journey 4: a trainee starts from a template', () => {
  it('clones a template, changes a value, sees the result move, saves, and cannot approve', async () => {
    const page = await pageAs('trainee@dubito.example');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Templates' }).click();
    await shows(
      page
        .getByRole('region', { name: 'Template gallery' })
        .or(page.getByTestId(/template-/))
        .first(),
    );
    await shot(page, '4-templates');
    await page
      .getByRole('button', { name: /^Use this template/ })
      .first()
      .click();
    const dialog = page.getByRole('dialog', { name: 'Start a draft from this template' });
    await dialog.getByLabel('Title of the new draft').fill('Training: gauge block KF-GB-50-201');
    await checkAccessibility(page, 'the template dialog');
    await dialog.getByRole('button', { name: 'Create draft' }).click();
    await page.waitForURL(/\/budgets\/\d+$/);
    const id = Number(/\/budgets\/(\d+)/.exec(page.url())?.[1]);
    await shows(page.getByTestId('budget-source'));

    const U = page.getByRole('region', { name: 'Result' }).getByRole('button', { name: /^U / });
    const before = await U.textContent();
    const item = await openInput(page, 0);
    await item.getByLabel('Distribution').selectOption({ label: 'Normal (Gaussian)' });
    await item.getByLabel('Given as').selectOption({ index: 0 });
    const u = item.getByLabel('Standard uncertainty u');
    await u.fill(String(Number(await u.inputValue()) * 3));
    await expect.poll(() => U.textContent()).not.toBe(before);
    await saveVersion(page, 'First input: standard uncertainty tripled for the exercise');
    await shot(page, '4-trainee-draft');

    await countIs(page.getByRole('button', { name: 'Approve' }), 0);
    const status = await page.evaluate(
      async (budgetId) =>
        (await fetch(`/api/budgets/${budgetId}/transitions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ to: 'approved', password: 'dubito-demo' }) }))
          .status,
      id,
    );
    expect(status).toBe(403);
    const stored = await page.evaluate(async (budgetId) => (await fetch(`/api/budgets/${budgetId}`)).json(), id);
    expect(stored.currentVersion).toBe(2);
    expect(stored.source).not.toBeNull();
  }, 180_000);
});

describe('journey 5: signed-out visitors and wrong roles are kept out', () => {
  const protectedPages = ['/budgets', '/budgets/new', '/budgets/1', '/budgets/1/versions', '/templates', '/audit', '/admin/users', '/admin/mail'];

  it('sends a signed-out visitor from every protected page to sign-in', async () => {
    const page = await pageAs(null);
    for (const path of protectedPages) {
      await page.goto(`${app.baseUrl}${path}`);
      await page.waitForURL(/\/sign-in/);
      await shows(page.getByRole('heading', { name: 'Sign in' }));
    }
    await shot(page, '5-sign-in');
    const api = await page.evaluate(async () => (await fetch('/api/budgets')).status);
    expect(api).toBe(401);
  }, 120_000);

  it('keeps a metrologist out of the audit trail and the admin pages (pages and API)', async () => {
    const page = await pageAs('metrologist@dubito.example');
    await countIs(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /audit/i }), 0);
    for (const path of ['/audit', '/admin/users', '/admin/mail']) {
      await page.goto(`${app.baseUrl}${path}`);
      await shows(page.getByText(/not available for your role/i));
    }
    await shot(page, '5-wrong-role');
    const status = await page.evaluate(async () => (await fetch('/api/audit')).status);
    expect(status).toBe(403);
  }, 120_000);
});
