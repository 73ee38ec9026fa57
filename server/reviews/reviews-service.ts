import type { Comment, NewComment, TransitionOutput, TransitionTarget } from '../../shared/api/reviews';
import type { BudgetDocument } from '../../shared/budget/schema';
import { canApprove, canResolveComment, canReturn, canSubmit, type BudgetStatus } from '../../shared/policy/policy';
import type { AccountsService } from '../accounts/accounts-service';
import { recordAudit } from '../audit/audit-repository';
import { getBudget, getVersion, recordApproval, updateBudget, type BudgetRow } from '../budgets/budgets-repository';
import { inTransaction, type Db } from '../db/connection';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import type { MailService } from '../mail/mail-service';
import { getComment, insertComment, listComments, setResolved } from './reviews-repository';

export interface ReviewsDeps {
  db: Db;
  accounts: AccountsService;
  mail: MailService;
  publicUrl: string;
}

export class ReviewsService {
  constructor(private readonly d: ReviewsDeps) {}

  private budget(id: number): BudgetRow {
    const b = getBudget(this.d.db, id);
    if (!b) throw new NotFoundError('no such budget');
    return b;
  }

  private link(id: number): string {
    return `${this.d.publicUrl}/budgets/${id}`;
  }

  comments(budgetId: number, version?: number): Comment[] {
    this.budget(budgetId);
    return listComments(this.d.db, budgetId, version);
  }

  /**
   * A new thread, or a reply when `parentId` names a comment of the same budget.
   * A reply joins its parent's thread: the quantity is the parent's, and a reply
   * to a reply is stored as a reply to the thread's first comment.
   */
  addComment(actor: SessionUser, budgetId: number, input: NewComment): Comment {
    this.budget(budgetId);
    return inTransaction(this.d.db, (tx) => {
      const v = getVersion(tx, budgetId, input.version);
      if (!v) throw new ValidationError(`budget ${budgetId} has no version ${input.version}`, 'version');
      let symbol = input.symbol ?? null;
      let parentId: number | null = null;
      if (input.parentId !== undefined && input.parentId !== null) {
        const parent = getComment(tx, budgetId, input.parentId);
        if (!parent) throw new ValidationError(`budget ${budgetId} has no comment ${input.parentId}`, 'parentId');
        if (input.symbol !== undefined && (input.symbol ?? null) !== parent.symbol) {
          throw new ValidationError('a reply belongs to the thread of the comment it answers; leave out "symbol" or give the same one', 'symbol');
        }
        symbol = parent.symbol;
        parentId = parent.parentId ?? parent.id;
      } else if (symbol !== null) {
        const doc = JSON.parse(v.document) as BudgetDocument;
        const known = [...doc.inputs.map((q) => q.symbol), ...(doc.constants ?? []).map((c) => c.symbol), doc.measurand.symbol];
        if (!known.includes(symbol)) throw new ValidationError(`"${symbol}" is not a quantity of version ${input.version}`, 'symbol');
      }
      const at = Date.now();
      const id = insertComment(tx, { budgetId, versionNumber: input.version, symbol, parentId, authorId: actor.id, body: input.body, at });
      recordAudit(tx, {
        actorId: actor.id,
        action: 'comment.created',
        budgetId,
        versionNumber: input.version,
        at,
        detail: { commentId: id, symbol, body: input.body, ...(parentId !== null ? { parentId } : {}) },
      });
      return getComment(tx, budgetId, id)!;
    });
  }

  resolveComment(actor: SessionUser, budgetId: number, commentId: number, resolved: boolean): Comment {
    return inTransaction(this.d.db, (tx) => {
      const b = getBudget(tx, budgetId);
      const c = b && getComment(tx, budgetId, commentId);
      if (!b || !c) throw new NotFoundError('no such comment');
      if (!canResolveComment(actor, b, c.authorId)) throw new ForbiddenError('only the author, the owner or a reviewer may resolve this comment');
      if (c.resolved === resolved) return c;
      const at = Date.now();
      setResolved(tx, commentId, resolved, actor.id, at);
      recordAudit(tx, {
        actorId: actor.id,
        action: resolved ? 'comment.resolved' : 'comment.reopened',
        budgetId,
        versionNumber: c.versionNumber,
        at,
        detail: { commentId },
      });
      return getComment(tx, budgetId, commentId)!;
    });
  }

  /**
   * draft → in_review (owner), in_review → approved (reviewer or admin, not the
   * owner nor the version's author, password re-entered as signature),
   * in_review → draft (returned with a comment).
   */
  async transition(
    actor: SessionUser,
    budgetId: number,
    input: { to: TransitionTarget; comment?: string; password?: string },
  ): Promise<TransitionOutput> {
    const b = this.budget(budgetId);
    const illegal = () => new ConflictError(`a budget that is ${b.status.replace('_', ' ')} cannot go to ${input.to.replace('_', ' ')}`, 'invalid_transition');
    let signatureOk = false;
    if (input.to === 'in_review') {
      if (!canSubmit(actor, b)) throw new ForbiddenError('only the owner submits a budget for review');
      if (b.status !== 'draft') throw illegal();
    } else if (input.to === 'approved') {
      const v = getVersion(this.d.db, budgetId, b.currentVersion)!;
      if (!canApprove(actor, b, v.authorId)) {
        throw new ForbiddenError(
          actor.role === 'reviewer' || actor.role === 'admin' ? 'nobody approves a budget they own or wrote' : 'only a reviewer or an admin approves',
        );
      }
      if (b.status !== 'in_review') throw illegal();
      if (!input.password) throw new ValidationError('re-enter your password to sign the approval', 'password');
      signatureOk = await this.d.accounts.verifySignature(actor.id, input.password, { budgetId, versionNumber: b.currentVersion });
      if (!signatureOk) throw new ForbiddenError('the password does not match; the approval was not signed', 'signature_rejected');
    } else {
      if (!canReturn(actor, b)) throw new ForbiddenError('only a reviewer or an admin other than the owner returns a budget');
      if (b.status !== 'in_review') throw illegal();
      if (!input.comment?.trim()) throw new ValidationError('say why the budget is returned', 'comment');
    }

    const out = inTransaction(this.d.db, (tx) => {
      const now = getBudget(tx, budgetId)!;
      if (now.status !== b.status || now.currentVersion !== b.currentVersion) {
        throw new ConflictError('the budget changed meanwhile; reload it', 'stale_version', { currentVersion: now.currentVersion });
      }
      const at = Date.now();
      const n = now.currentVersion;
      if (input.to === 'in_review') {
        updateBudget(tx, budgetId, { status: 'in_review', returned: false, updatedAt: at });
      } else if (input.to === 'approved' && signatureOk) {
        recordApproval(tx, budgetId, n, actor.id, at);
        updateBudget(tx, budgetId, { status: 'approved', approvedVersion: n, returned: false, updatedAt: at });
      } else {
        updateBudget(tx, budgetId, { status: 'draft', returned: true, updatedAt: at });
      }
      if (input.comment?.trim()) {
        insertComment(tx, { budgetId, versionNumber: n, symbol: null, authorId: actor.id, body: input.comment.trim(), at });
      }
      const action = input.to === 'in_review' ? 'budget.submitted' : input.to === 'approved' ? 'budget.approved' : 'budget.returned';
      recordAudit(tx, {
        actorId: actor.id,
        action,
        budgetId,
        versionNumber: n,
        at,
        detail: { from: now.status, to: input.to, ...(input.comment ? { comment: input.comment.trim() } : {}), ...(signatureOk ? { signedBy: actor.email } : {}) },
      });
      return { status: (input.to === 'draft' ? 'draft' : input.to) as BudgetStatus, version: n, returned: input.to === 'draft' };
    });

    this.notify(actor, b, input.to, out.version, input.comment);
    return out;
  }

  private notify(actor: SessionUser, b: BudgetRow, to: TransitionTarget, version: number, comment?: string): void {
    const link = this.link(b.id);
    if (to === 'in_review') {
      const reviewers = this.d.accounts.reviewersExcept(b.ownerId).map((u) => u.email);
      this.d.mail.notify({
        to: reviewers,
        subject: `Review requested: ${b.title}`,
        text: `${actor.name} asks for a review of "${b.title}", version ${version}.\n\nOpen it here:\n${link}\n`,
      });
      return;
    }
    const owner = this.d.accounts.userById(b.ownerId);
    if (!owner || owner.id === actor.id) return;
    if (to === 'approved') {
      this.d.mail.notify({
        to: [owner.email],
        subject: `Approved: ${b.title}`,
        text: `${actor.name} approved version ${version} of "${b.title}".\n\n${link}\n`,
      });
    } else {
      this.d.mail.notify({
        to: [owner.email],
        subject: `Returned: ${b.title}`,
        text: `${actor.name} returned version ${version} of "${b.title}" to draft:\n\n${comment ?? ''}\n\n${link}\n`,
      });
    }
  }
}
