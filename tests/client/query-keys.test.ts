import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import { afterAccountChange, afterCommentChanged, afterEvidenceAdded, afterIdentityChange, afterReviewDecision, afterTemplateChanged, afterVersionStored } from '../../src/budget/invalidate';
import { queryKeys } from '../../src/budget/query-keys';

const k = queryKeys;
const page = { limit: 12, offset: 0 };

/** One cache entry for every kind of key, for budgets 1 and 2. */
function everyKey(): Record<string, readonly unknown[]> {
  const keys: Record<string, readonly unknown[]> = {
    list: k.budgets.list({ status: 'draft' }, { ...page, sort: 'title', order: 'asc' }),
    index: k.budgets.index(),
    templates: k.budgets.templates(),
    reviewQueue: k.budgets.reviewQueue(),
    auditPage: k.audit.page({ budget: 1 }, page),
    auditActors: k.audit.actors(),
    users: k.users.page({}, { ...page, sort: 'name', order: 'asc' }),
    mail: k.mail(),
    me: k.me(),
    token: k.authToken('abcdefghijkl'),
    computeLimits: k.computeLimits(),
  };
  for (const id of [1, 2]) {
    keys[`budget${id}`] = k.budgets.detail(id);
    keys[`versionList${id}`] = k.budgets.versionList(id);
    keys[`versionPage${id}`] = k.budgets.versionPage(id, { ...page, order: 'desc' });
    keys[`version${id}`] = k.budgets.version(id, 3);
    keys[`diff${id}`] = k.budgets.diff(id, 1, 3);
    keys[`comments${id}`] = k.budgets.comments(id);
    keys[`review${id}`] = k.budgets.review(id);
    keys[`attachments${id}`] = k.budgets.attachmentsOf(id, 3);
  }
  return keys;
}

/** Runs a change against a cache holding every key; gives the names of the entries it made stale. */
async function staleAfter(change: (qc: QueryClient) => Promise<void> | void): Promise<string[]> {
  const qc = new QueryClient();
  const keys = everyKey();
  for (const key of Object.values(keys)) qc.setQueryData(key, { cached: true });
  await change(qc);
  return Object.entries(keys)
    .filter(([, key]) => qc.getQueryState(key)?.isInvalidated)
    .map(([name]) => name)
    .sort();
}

describe('the query-key factory is hierarchical', () => {
  it('puts everything about a budget under its key: invalidating the budget covers its versions, comparisons, review and evidence, not another budget', async () => {
    const stale = await staleAfter((qc) => qc.invalidateQueries({ queryKey: k.budgets.detail(1) }));
    expect(stale).toEqual(['attachments1', 'budget1', 'comments1', 'diff1', 'review1', 'version1', 'versionList1', 'versionPage1'].sort());
  });

  it('covers every page of the versions and each stored version under the versions prefix', async () => {
    const stale = await staleAfter((qc) => qc.invalidateQueries({ queryKey: k.budgets.versions(2) }));
    expect(stale).toEqual(['version2', 'versionList2', 'versionPage2']);
  });

  it('keeps the lists (pages, index, templates) under one prefix, apart from any one budget', async () => {
    const stale = await staleAfter((qc) => qc.invalidateQueries({ queryKey: k.budgets.lists() }));
    expect(stale).toEqual(['index', 'list', 'templates']);
  });

  it('covers every page of the audit trail and its actors under the audit prefix', async () => {
    const stale = await staleAfter((qc) => qc.invalidateQueries({ queryKey: k.audit.all() }));
    expect(stale).toEqual(['auditActors', 'auditPage']);
  });

  it('gives different pages and filters different keys', () => {
    expect(k.budgets.list({}, page)).not.toEqual(k.budgets.list({}, { ...page, offset: 12 }));
    expect(k.budgets.list({ returned: true }, page)).not.toEqual(k.budgets.list({ returned: false }, page));
    expect(k.budgets.attachmentsOf(1, 2)).not.toEqual(k.budgets.attachmentsOf(1, 3));
  });
});

describe('each change refreshes what it makes stale', () => {
  it('a stored version refreshes the budget with everything under it, every list, the queue and the audit trail', async () => {
    const stale = await staleAfter((qc) => afterVersionStored(qc, 1));
    expect(stale).toEqual(
      ['attachments1', 'auditActors', 'auditPage', 'budget1', 'comments1', 'diff1', 'index', 'list', 'review1', 'reviewQueue', 'templates', 'version1', 'versionList1', 'versionPage1'].sort(),
    );
  });

  it('evidence on a draft refreshes the evidence, the review state and the trail; on an approved version, everything a stored version does', async () => {
    expect(await staleAfter((qc) => afterEvidenceAdded(qc, 2, false))).toEqual(['attachments2', 'auditActors', 'auditPage', 'review2']);
    expect(await staleAfter((qc) => afterEvidenceAdded(qc, 2, true))).toEqual(await staleAfter((qc) => afterVersionStored(qc, 2)));
  });

  it('a comment refreshes the threads, the review state, the queue and the trail of its budget only', async () => {
    expect(await staleAfter((qc) => afterCommentChanged(qc, 1))).toEqual(['auditActors', 'auditPage', 'comments1', 'review1', 'reviewQueue']);
  });

  it('a review decision refreshes the budget, the lists, the queue, the trail and the mail sent', async () => {
    const stale = await staleAfter((qc) => afterReviewDecision(qc, 2));
    expect(stale).toContain('mail');
    expect(stale).toContain('auditPage');
    expect(stale).toContain('versionPage2');
    expect(stale).toContain('reviewQueue');
    expect(stale).toContain('list');
    expect(stale).not.toContain('budget1');
  });

  it('a template change refreshes the templates and the budget', async () => {
    const stale = await staleAfter((qc) => afterTemplateChanged(qc, 1));
    expect(stale).toEqual(expect.arrayContaining(['templates', 'budget1', 'auditPage']));
    expect(stale).not.toContain('budget2');
  });

  it('an account change refreshes the users, the mail and the trail, and nothing about budgets', async () => {
    expect(await staleAfter((qc) => afterAccountChange(qc))).toEqual(['auditActors', 'auditPage', 'mail', 'users']);
  });

  it('a sign-in or sign-out keeps nothing read under the other identity', () => {
    const qc = new QueryClient();
    qc.setQueryData(k.budgets.detail(1), { cached: true });
    afterIdentityChange(qc, { id: 7, email: 'r@lab.test', name: 'R', role: 'reviewer' });
    expect(qc.getQueryData(k.budgets.detail(1))).toBeUndefined();
    expect(qc.getQueryData(k.me())).toEqual({ id: 7, email: 'r@lab.test', name: 'R', role: 'reviewer' });
  });
});
