import { describe, expect, it } from 'vitest';
import { versionStatus } from '../../shared/policy/version-status';

const approvedBudget = { status: 'approved' as const, returned: false, currentVersion: 3 };

describe('versionStatus: each version shows its own status', () => {
  it('an older version never approved is superseded, even when the budget is approved', () => {
    expect(versionStatus(approvedBudget, { number: 1, approvedAt: null })).toBe('superseded');
  });
  it('a version approved once stays approved after later versions', () => {
    expect(versionStatus({ status: 'draft', returned: false, currentVersion: 4 }, { number: 3, approvedAt: 1_700_000_000_000 })).toBe('approved');
  });
  it('the current version has the budget status, a returned draft as returned', () => {
    expect(versionStatus({ status: 'in_review', returned: false, currentVersion: 2 }, { number: 2, approvedAt: null })).toBe('in_review');
    expect(versionStatus({ status: 'draft', returned: true, currentVersion: 2 }, { number: 2, approvedAt: null })).toBe('returned');
    expect(versionStatus({ status: 'draft', returned: false, currentVersion: 2 }, { number: 2, approvedAt: null })).toBe('draft');
  });
});
