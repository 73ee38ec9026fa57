import { createHash } from 'node:crypto';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { containsText, countIs, shows } from './support/page-expect';
import { useBrowserSession } from './support/session';

/*
 * Review as a controlled act, in Debian's Chromium against the built client and
 * the real server with the demo lab: the reviewer's queue, the approve dialog
 * with what is signed and the reason it asks for, the returned reason at the
 * top of the author's editor, evidence, and a save over a newer version that
 * keeps the other person's change. Screenshots go to tests/.artifacts/screenshots.
 */

const { app, pageAs, shot, checkAccessibility } = useBrowserSession('review');

/** A minimal PDF, enough for the server's content sniffing. */
const PDF = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n', 'latin1');

async function openBudget(page: Page, title: RegExp): Promise<number> {
  await page.goto(`${app.baseUrl}/budgets`);
  await page.getByRole('link', { name: title }).first().click();
  await page.waitForURL(/\/budgets\/\d+$/);
  return Number(/\/budgets\/(\d+)/.exec(page.url())?.[1]);
}

async function saveVersion(page: Page, note: string): Promise<void> {
  await page.getByRole('button', { name: 'Save version…' }).click();
  const dialog = page.getByRole('dialog', { name: /Save a new version/ });
  await dialog.getByLabel('Change note').fill(note);
  await dialog.getByRole('button', { name: 'Save version' }).click();
}

describe('review and approval as a controlled act', () => {
  it('queue → return with a reason the author sees → evidence → submit over open threads → approve with a reason', async () => {
    const title = /Gauge block 50 mm by mechanical comparison/;
    const author = await pageAs('metrologist@dubito.example');
    const id = await openBudget(author, title);
    await author.getByRole('button', { name: 'Submit for review' }).click();
    await shows(author.getByText('In review'));

    // the reviewer's home page lists it
    const reviewer = await pageAs('reviewer@dubito.example');
    await reviewer.goto(`${app.baseUrl}/budgets`);
    const queue = reviewer.getByTestId('review-queue');
    await shows(queue.getByRole('link', { name: title }));
    await shot(reviewer, 'queue');
    await queue.getByRole('link', { name: title }).click();
    await reviewer.waitForURL(new RegExp(`/budgets/${id}$`));

    await reviewer.getByLabel('New comment on the budget').fill('Attach the comparator calibration certificate.');
    await reviewer.getByRole('button', { name: 'Add comment' }).click();
    await shows(reviewer.getByText('Attach the comparator calibration certificate.'));
    await reviewer.getByRole('button', { name: 'Return to author' }).click();
    const back = reviewer.getByRole('dialog', { name: /Return version 1/ });
    await back.getByLabel('Why is it returned?').fill('The evidence for the reference gauge block is missing.');
    await checkAccessibility(reviewer, 'the return dialog');
    await back.getByRole('button', { name: 'Send back' }).click();
    await shows(reviewer.getByText('Returned').first());

    // the author sees who returned it and why, at the top of the editor
    await author.goto(`${app.baseUrl}/budgets/${id}`);
    const notice = author.getByTestId('returned-notice');
    await containsText(notice, /Returned to draft by Ilse Varga/);
    await containsText(notice, 'The evidence for the reference gauge block is missing.');

    // evidence for one input, with its SHA-256
    const evidence = author.getByTestId('evidence-panel');
    await evidence.getByLabel('File (PDF, PNG, JPEG, WebP)').setInputFiles({ name: 'KF-GB-ref certificate.pdf', mimeType: 'application/pdf', buffer: PDF });
    const symbol = (await evidence.getByLabel('Supports').locator('option').nth(1).getAttribute('value'))!;
    await evidence.getByLabel('Supports').selectOption(symbol);
    await evidence.getByRole('button', { name: 'Attach evidence' }).click();
    await shows(evidence.getByRole('link', { name: 'KF-GB-ref certificate.pdf' }));
    await containsText(evidence.getByText(/^SHA-256 /), `SHA-256 ${createHash('sha256').update(PDF).digest('hex')}`);
    await shot(author, 'returned-and-evidence');
    await evidence.scrollIntoViewIfNeeded();
    await shot(evidence, 'evidence-panel');

    // submitting with open threads lists them first
    await author.getByRole('button', { name: 'Submit for review' }).click();
    const warn = author.getByRole('dialog', { name: /open comment thread/ });
    await shows(warn.getByText('Attach the comparator calibration certificate.'));
    await shows(warn.getByText('The evidence for the reference gauge block is missing.'));
    await shot(author, 'submit-open-threads');
    await warn.getByRole('button', { name: 'Submit anyway' }).click();
    await shows(author.getByText('In review'));

    // the approve dialog shows what is signed and asks why
    await reviewer.goto(`${app.baseUrl}/budgets/${id}`);
    await reviewer.getByRole('button', { name: 'Approve' }).click();
    const sign = reviewer.getByRole('dialog', { name: /Approve version 1/ });
    await shows(sign.getByTestId('signing-brief'));
    await shows(sign.getByTestId('open-threads').getByText('Attach the comparator calibration certificate.'));
    await containsText(sign.getByTestId('signing-statement'), /^L = \(50\.\d+ ± 0\.\d+\) mm/);
    await containsText(sign.getByTestId('signing-verdict'), /Monte Carlo/);
    await shows(sign.getByText('KF-GB-ref certificate.pdf'));
    await containsText(sign.getByTestId('signing-meaning'), /ISO\/IEC 17025/);
    await sign.getByLabel('Your password (signature)').fill('dubito-demo');
    await sign.getByRole('button', { name: 'Sign and approve' }).click();
    await shows(sign.getByText(/Say why you sign despite the points above/));
    await shot(reviewer, 'approve-dialog');
    await sign.getByLabel(/Why do you approve although 2 comment threads are still open/).fill('The certificate is attached; the threads are answered by it.');
    await sign.getByRole('button', { name: 'Sign and approve' }).click();
    await shows(reviewer.getByText('Approved').first());
    await containsText(reviewer.getByTestId('review-decisions'), 'The certificate is attached; the threads are answered by it.');
    const history = reviewer.getByTestId('review-decisions');
    await history.scrollIntoViewIfNeeded();
    await shot(history, 'approved-history');

    const stored = await reviewer.evaluate(async (budgetId) => (await fetch(`/api/budgets/${budgetId}/review`)).json(), id);
    expect(stored.status).toBe('approved');
    expect(stored.decisions.map((d: { decision: string; reason: string }) => [d.decision, d.reason])).toEqual([
      ['returned', 'The evidence for the reference gauge block is missing.'],
      ['approved', 'The certificate is attached; the threads are answered by it.'],
    ]);
  }, 240_000);

  it('saving over a newer version shows their change beside mine and keeps it', async () => {
    const title = /Industrial Pt100 probe at 100 °C/;
    const mine = await pageAs('metrologist@dubito.example');
    const theirs = await pageAs('metrologist@dubito.example');
    const id = await openBudget(mine, title);
    await theirs.goto(`${app.baseUrl}/budgets/${id}`);

    const newTitle = 'Industrial Pt100 probe at 100 °C in stirred bath KF-BATH2, serial 4411';
    await theirs.getByLabel('Title').fill(newTitle);
    await saveVersion(theirs, 'serial number in the title');
    await shows(theirs.getByText('Saved as version 2.'));

    const description = mine.getByRole('region', { name: 'Measurand' }).getByLabel('Description');
    await description.fill('resistance of the probe at the bath temperature');
    await saveVersion(mine, 'measurand described');
    const conflict = mine.getByRole('dialog', { name: 'Someone saved this budget meanwhile' });
    const row = conflict.getByTestId('merge-change');
    await countIs(row, 1);
    await containsText(row, /title/);
    await containsText(row, newTitle);
    await shot(mine, 'conflict-dialog');
    await conflict.getByRole('button', { name: 'Save the merge as v3' }).click();
    await shows(mine.getByText('Saved as version 3.'));

    const stored = await mine.evaluate(async (budgetId) => (await fetch(`/api/budgets/${budgetId}`)).json(), id);
    expect(stored.currentVersion).toBe(3);
    expect(stored.document.title).toBe(newTitle);
    expect(stored.document.measurand.description).toBe('resistance of the probe at the bath temperature');
  }, 180_000);

  it('one edit turns Save on once, when its own recompute answers, even while the first live recompute is slow', async () => {
    const page = await pageAs('metrologist@dubito.example');
    // the live worker's script is held back, so the first recompute cannot answer before the edit is rendered
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(/live\.worker/, async (route) => {
      await held;
      await route.continue();
    });
    await openBudget(page, /Industrial Pt100 probe at 100 °C/);
    const save = page.getByRole('button', { name: 'Save version…' });
    await save.evaluate((button) => {
      const seen = [(button as HTMLButtonElement).disabled ? 'off' : 'on'];
      (window as unknown as { saveStates: string[] }).saveStates = seen;
      new MutationObserver(() => seen.push((button as HTMLButtonElement).disabled ? 'off' : 'on')).observe(button, { attributes: true, attributeFilter: ['disabled'] });
    });
    await page.getByLabel('Title').fill('Industrial Pt100 probe at 100 °C, edited');
    // the edit is rendered and its recompute waits for the worker
    await expect.poll(() => save.getAttribute('title')).toBe('Fix the problems shown first');
    release();
    // the worker's code arrives and computes first: on a busy machine that takes longer than the poll's default second
    await expect.poll(() => save.isEnabled(), { timeout: 20_000 }).toBe(true);
    expect(await page.evaluate(() => (window as unknown as { saveStates: string[] }).saveStates)).toEqual(['off', 'on']);
  }, 120_000);

  it('a role change asks for confirmation and a reason before anything is sent', async () => {
    const admin = await pageAs('admin@dubito.example');
    await admin.goto(`${app.baseUrl}/admin/users`);
    const row = admin.getByTestId('user-trainee@dubito.example');
    await row.getByLabel('Role of Nia Castell').selectOption('metrologist');
    const confirm = admin.getByRole('dialog', { name: 'Change the role of Nia Castell' });
    await containsText(confirm, /from trainee to metrologist/);
    await confirm.getByRole('button', { name: 'Make metrologist' }).click();
    await shows(confirm.getByText('say why the role or the access changes; the reason goes into the audit trail'));
    await shot(admin, 'role-change-dialog');
    await confirm.getByRole('button', { name: 'Cancel' }).click();
    await countIs(admin.getByRole('dialog', { name: 'Change the role of Nia Castell' }), 0);
    expect(await row.getByLabel('Role of Nia Castell').inputValue()).toBe('trainee');
    const users = await admin.evaluate(async () => (await fetch('/api/users')).json());
    expect(users.find((u: { email: string }) => u.email === 'trainee@dubito.example').role).toBe('trainee');

    await row.getByRole('button', { name: 'Deactivate Nia Castell' }).click();
    await shows(admin.getByRole('dialog', { name: 'Deactivate Nia Castell' }).getByLabel('Reason (kept in the audit trail)'));
  }, 120_000);
});
