import type { Me } from '../../../shared/api/accounts';
import { can, canEditBudget, isEditableStatus, type BudgetFacts } from '../../../shared/policy/policy';

/** The signed-in user as the editor needs them. */
export type Editor = Pick<Me, 'id' | 'role' | 'name'>;

/** Why the budget on screen is read-only, said above it; null when it is editable (or a new budget). */
export type ReadOnlyReason = 'past-version' | 'in-review' | 'approved' | 'not-yours' | null;

export interface EditorAccess {
  /** The user may change this budget at all (the policy map: `budget.create`, or `canEditBudget`). */
  mayEdit: boolean;
  /** An approved version on screen that the user has not chosen to edit as a new draft. */
  approvedLock: boolean;
  readOnly: boolean;
  reason: ReadOnlyReason;
}

/**
 * Who may edit what the editor shows, from the shared policy map: a new budget
 * needs `budget.create`; a stored one `canEditBudget` and a status that allows
 * saving (`isEditableStatus`). A past version is always read-only; an approved
 * one until the user asks to edit it as a new draft (`unlocked`).
 */
export function editorAccess(a: { me: Editor; isNew: boolean; facts: BudgetFacts | null; viewingOld: boolean; unlocked: boolean }): EditorAccess {
  const { isNew } = a;
  const mayEdit = isNew ? can(a.me.role, 'budget.create') : !!a.facts && canEditBudget(a.me, a.facts);
  const statusAllows = !a.facts || isEditableStatus(a.facts.status);
  const approvedLock = a.facts?.status === 'approved' && !a.unlocked;
  const readOnly = a.viewingOld || !mayEdit || !statusAllows || approvedLock;
  const reason: ReadOnlyReason = a.viewingOld ? 'past-version' : a.facts?.status === 'in_review' ? 'in-review' : approvedLock ? 'approved' : !mayEdit && !isNew ? 'not-yours' : null;
  return { mayEdit, approvedLock, readOnly, reason };
}
