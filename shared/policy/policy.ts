/**
 * Who may do what in Dubito. Pure TypeScript: the server enforces it on every
 * route, the client uses it to show or hide actions.
 *
 * Two layers:
 *  - `POLICY` maps each action to the roles that may attempt it at all;
 *  - the predicates below add the rules that depend on the budget
 *    (ownership, status, authorship of the version being signed).
 */

export const ROLES = ['admin', 'metrologist', 'reviewer', 'auditor', 'trainee'] as const;
export type Role = (typeof ROLES)[number];

export const BUDGET_STATUSES = ['draft', 'in_review', 'approved'] as const;
export type BudgetStatus = (typeof BUDGET_STATUSES)[number];

const POLICY = {
  /** Read budgets, versions, diffs, comments, attachments, templates; export. */
  'budget.read': ['admin', 'metrologist', 'reviewer', 'auditor', 'trainee'],
  /** Create a budget (also by import). */
  'budget.create': ['admin', 'metrologist', 'trainee'],
  /** Save a new version of a budget (owner rules in `canEditBudget`). */
  'budget.edit': ['admin', 'metrologist', 'trainee'],
  /** Clone a budget or template into a new draft owned by the caller. */
  'budget.clone': ['admin', 'metrologist', 'trainee'],
  /** Ask for any status change; the specific change is checked below. */
  'budget.transition': ['admin', 'metrologist', 'reviewer', 'trainee'],
  /** draft → in_review (owner only). */
  'budget.submit': ['admin', 'metrologist', 'trainee'],
  /** in_review → approved (never the owner or the author of the version). */
  'budget.approve': ['admin', 'reviewer'],
  /** in_review → draft with a comment (never the owner). */
  'budget.return': ['admin', 'reviewer'],
  /** Mark a budget as a template or not. */
  'template.manage': ['admin'],
  'comment.create': ['admin', 'metrologist', 'reviewer', 'trainee'],
  'comment.resolve': ['admin', 'metrologist', 'reviewer', 'trainee'],
  /** Attach evidence (certificates, images) to a budget. */
  'attachment.create': ['admin', 'metrologist', 'trainee'],
  /** Turn a CSV file into observation values (writes nothing). */
  'observations.upload': ['admin', 'metrologist', 'trainee'],
  'audit.read': ['admin', 'auditor'],
  'user.manage': ['admin'],
  /** Read the outbox of sent mail. */
  'mail.read': ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof POLICY;

/** May this role attempt this action at all? */
export function can(role: Role | null | undefined, action: Action): boolean {
  if (!role) return false;
  return (POLICY[action] as readonly Role[]).includes(role);
}

export interface Actor {
  id: number;
  role: Role;
}

export interface BudgetFacts {
  ownerId: number;
  status: BudgetStatus;
  isTemplate: boolean;
}

function isOwner(actor: Actor, budget: BudgetFacts): boolean {
  return actor.id === budget.ownerId;
}

/**
 * May the actor save a new version? Templates belong to admins; other budgets
 * to their owner; trainees only while the budget is a draft. Whether the
 * status allows a save at all (not while in review) is a separate rule:
 * `isEditableStatus`.
 */
export function canEditBudget(actor: Actor, budget: BudgetFacts): boolean {
  if (!can(actor.role, 'budget.edit')) return false;
  if (budget.isTemplate) return actor.role === 'admin';
  if (!isOwner(actor, budget)) return false;
  if (actor.role === 'trainee' && budget.status !== 'draft') return false;
  return true;
}

/** A budget in review is frozen until it is approved or returned. */
export function isEditableStatus(status: BudgetStatus): boolean {
  return status !== 'in_review';
}

/** draft → in_review: the owner (or an admin for a template). */
export function canSubmit(actor: Actor, budget: BudgetFacts): boolean {
  if (!can(actor.role, 'budget.submit')) return false;
  return isOwner(actor, budget) || (budget.isTemplate && actor.role === 'admin');
}

/**
 * in_review → approved: a reviewer or admin who neither owns the budget nor
 * wrote the version under review.
 */
export function canApprove(actor: Actor, budget: BudgetFacts, versionAuthorId: number): boolean {
  if (!can(actor.role, 'budget.approve')) return false;
  return !isOwner(actor, budget) && actor.id !== versionAuthorId;
}

/** in_review → draft: a reviewer or admin who does not own the budget. */
export function canReturn(actor: Actor, budget: BudgetFacts): boolean {
  if (!can(actor.role, 'budget.return')) return false;
  return !isOwner(actor, budget);
}

/** Resolve or reopen a comment: its author, the budget's owner, a reviewer or an admin. */
export function canResolveComment(actor: Actor, budget: BudgetFacts, commentAuthorId: number): boolean {
  if (!can(actor.role, 'comment.resolve')) return false;
  return actor.id === commentAuthorId || isOwner(actor, budget) || actor.role === 'reviewer' || actor.role === 'admin';
}

/** Attach evidence: whoever may edit the budget (status aside). */
export function canAttach(actor: Actor, budget: BudgetFacts): boolean {
  if (!can(actor.role, 'attachment.create')) return false;
  return canEditBudget(actor, { ...budget, status: budget.status === 'in_review' ? 'draft' : budget.status });
}
