import { describe, expect, it } from 'vitest';
import type { BudgetFacts } from '../../shared/policy/policy';
import { editorAccess } from '../../src/features/editor/access';

const owner = { id: 1, role: 'metrologist' as const, name: 'A. Wren' };
const other = { id: 2, role: 'metrologist' as const, name: 'B. Moss' };
const trainee = { id: 3, role: 'trainee' as const, name: 'C. Finch' };
const reviewer = { id: 4, role: 'reviewer' as const, name: 'D. Heron' };
const facts = (status: BudgetFacts['status'], ownerId = 1): BudgetFacts => ({ ownerId, status, isTemplate: false });
const stored = { isNew: false, viewingOld: false, unlocked: false };

describe('editorAccess: who may edit the budget on screen (the shared policy map)', () => {
  it('lets the owner edit a draft', () => {
    expect(editorAccess({ me: owner, facts: facts('draft'), ...stored })).toEqual({ mayEdit: true, approvedLock: false, readOnly: false, reason: null });
  });

  it('shows another’s budget read-only, saying only the owner can change it', () => {
    expect(editorAccess({ me: other, facts: facts('draft'), ...stored })).toMatchObject({ mayEdit: false, readOnly: true, reason: 'not-yours' });
  });

  it('freezes a budget in review for everyone, the owner included', () => {
    expect(editorAccess({ me: owner, facts: facts('in_review'), ...stored })).toMatchObject({ mayEdit: true, readOnly: true, reason: 'in-review' });
  });

  it('keeps an approved version read-only until the owner starts a new draft from it', () => {
    expect(editorAccess({ me: owner, facts: facts('approved'), ...stored })).toMatchObject({ approvedLock: true, readOnly: true, reason: 'approved' });
    expect(editorAccess({ me: owner, facts: facts('approved'), ...stored, unlocked: true })).toMatchObject({ approvedLock: false, readOnly: false, reason: null });
  });

  it('does not let a trainee edit their own budget once it is approved, even unlocked', () => {
    expect(editorAccess({ me: { ...trainee, id: 1 }, facts: facts('approved'), ...stored, unlocked: true })).toMatchObject({ mayEdit: false, readOnly: true, reason: 'not-yours' });
  });

  it('shows a past version read-only whoever looks', () => {
    expect(editorAccess({ me: owner, facts: facts('draft'), ...stored, viewingOld: true })).toMatchObject({ readOnly: true, reason: 'past-version' });
  });

  it('opens a new budget to the roles that may create one', () => {
    expect(editorAccess({ me: owner, facts: null, isNew: true, viewingOld: false, unlocked: false })).toMatchObject({ mayEdit: true, readOnly: false, reason: null });
    expect(editorAccess({ me: reviewer, facts: null, isNew: true, viewingOld: false, unlocked: false })).toMatchObject({ mayEdit: false, readOnly: true });
  });
});
