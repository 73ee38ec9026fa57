import { reportedOf } from '../../shared/compute/reported-result';
import { superscript } from '../../shared/format/superscript';
import { unitPieces, writeUnit } from '../../shared/format/unit-symbols';
import { resultStatement } from '../../shared/gum/statement';
import { verdictOf as validationVerdict } from '../../shared/presentation/verdict';
import type { Comment, NewComment, ReviewQueueItem, ReviewState, SigningCaveat, TransitionOutput, TransitionTarget } from '../../shared/api/reviews';
import type { BudgetResult, ValidationVerdict } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import { readStoredResult } from '../../shared/budget/stored-result';
import { canApprove, canResolveComment, canReturn, canSubmit, type BudgetStatus } from '../../shared/policy/policy';
import type { AccountsService } from '../accounts/accounts-service';
import type { AuditService } from '../audit/audit-service';
import { diffBudgets } from '../budgets/budget-diff';
import type { BudgetRow, BudgetsService, VersionRow } from '../budgets/budgets-service';
import { inTransaction, type Db, type DbLike } from '../db/connection';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import type { MailService } from '../mail/mail-service';
import type { AttachmentsService } from '../uploads/attachments-service';
import { getComment, insertComment, insertDecision, lastVersionSeenBy, listComments, listDecisions, openThreadCounts, openThreads, setThreadResolved } from './reviews-repository';

/** The clause 8 verdict of a stored result; results stored before verdicts existed carry only `passed`. */
function verdictOf(result: BudgetResult): { verdict: ValidationVerdict; reason: string | null } | null {
  const v = result.validation;
  if (!v) return null;
  return { verdict: validationVerdict(v), reason: v.reason ?? null };
}

/**
 * Why signing this version needs a reason: open threads, or a GUM result the
 * Monte Carlo method did not validate (JCGM 101:2008 clause 8), could not
 * decide on, or was not run for.
 */
export function signingCaveats(open: number, result: BudgetResult): SigningCaveat[] {
  const out: SigningCaveat[] = [];
  if (open > 0) out.push({ code: 'open_threads', message: `${open} comment thread${open === 1 ? ' is' : 's are'} still open` });
  const v = verdictOf(result);
  if (!v) out.push({ code: 'no_monte_carlo', message: 'the Monte Carlo method was not run, so the GUM result is not validated (JCGM 101:2008 clause 8)' });
  else if (v.verdict === 'not-validated') out.push({ code: 'not_validated', message: 'the Monte Carlo method did not validate the GUM result (JCGM 101:2008 clause 8)' });
  else if (v.verdict === 'inconclusive') out.push({ code: 'inconclusive', message: `the validation by the Monte Carlo method is inconclusive${v.reason ? `: ${v.reason}` : ''}` });
  else if (v.verdict === 'not-possible') out.push({ code: 'not_possible', message: `the GUM result could not be validated${v.reason ? `: ${v.reason}` : ''}` });
  return out;
}

export interface ReviewsDeps {
  db: Db;
  budgets: BudgetsService;
  attachments: AttachmentsService;
  audit: AuditService;
  accounts: AccountsService;
  mail: MailService;
  publicUrl: string;
}

export class ReviewsService {
  constructor(private readonly d: ReviewsDeps) {}

  private link(id: number): string {
    return `${this.d.publicUrl}/budgets/${id}`;
  }

  comments(budgetId: number, version?: number): Comment[] {
    this.d.budgets.requireBudget(budgetId);
    return listComments(this.d.db, budgetId, version);
  }

  /**
   * A new thread, or a reply when `parentId` names a comment of the same budget.
   * A reply joins its parent's thread: the quantity is the parent's, and a reply
   * to a reply is stored as a reply to the thread's first comment.
   */
  addComment(actor: SessionUser, budgetId: number, input: NewComment): Comment {
    this.d.budgets.requireBudget(budgetId);
    return inTransaction(this.d.db, (tx) => {
      const v = this.d.budgets.findVersion(budgetId, input.version, tx);
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
      // a new word in a resolved thread is a new question: the thread opens again
      const reopens = parentId !== null && getComment(tx, budgetId, parentId)!.resolved;
      if (reopens) setThreadResolved(tx, parentId!, false, actor.id, at);
      this.d.audit.record(tx, {
        actorId: actor.id,
        action: 'comment.created',
        budgetId,
        versionNumber: input.version,
        at,
        detail: { commentId: id, symbol, body: input.body, ...(parentId !== null ? { parentId } : {}), ...(reopens ? { reopenedThread: parentId } : {}) },
      });
      return getComment(tx, budgetId, id)!;
    });
  }

  /**
   * Resolves or reopens the whole thread the comment belongs to, recording who
   * and when on each of its comments. The permission is judged on the thread's
   * first comment (its author may close their own question).
   */
  resolveComment(actor: SessionUser, budgetId: number, commentId: number, resolved: boolean): Comment {
    return inTransaction(this.d.db, (tx) => {
      const b = this.d.budgets.findBudget(budgetId, tx);
      const c = b && getComment(tx, budgetId, commentId);
      if (!b || !c) throw new NotFoundError('no such comment');
      const root = c.parentId === null ? c : (getComment(tx, budgetId, c.parentId) ?? c);
      if (!canResolveComment(actor, b, root.authorId)) throw new ForbiddenError('only the author, the owner or a reviewer may resolve this thread');
      if (root.resolved === resolved) return getComment(tx, budgetId, commentId)!;
      const at = Date.now();
      setThreadResolved(tx, root.id, resolved, actor.id, at);
      this.d.audit.record(tx, {
        actorId: actor.id,
        action: resolved ? 'comment.resolved' : 'comment.reopened',
        budgetId,
        versionNumber: root.versionNumber,
        at,
        detail: { commentId: root.id, thread: true },
      });
      return getComment(tx, budgetId, commentId)!;
    });
  }

  /** What a signature on the current version covers, and the decisions so far. */
  state(actor: SessionUser, budgetId: number): ReviewState {
    const b = this.d.budgets.requireBudget(budgetId);
    const db = this.d.db;
    const v = this.d.budgets.requireVersion(budgetId, b.currentVersion);
    const result = readStoredResult(v.result);
    const open = openThreads(db, budgetId);
    const decisions = listDecisions(db, budgetId);
    const lastDecision = decisions[decisions.length - 1];
    const seen = lastVersionSeenBy(db, budgetId, actor.id, b.currentVersion);
    const approved = b.approvedVersion !== null && b.approvedVersion < b.currentVersion ? b.approvedVersion : null;
    const baseline = seen !== null ? { version: seen, basis: 'seen' as const } : approved !== null ? { version: approved, basis: 'approved' as const } : null;
    const load = (x: VersionRow) => ({ number: x.number, document: JSON.parse(x.document) as Record<string, unknown>, result: readStoredResult(x.result) });
    const changes = baseline && baseline.version < b.currentVersion ? diffBudgets(load(this.d.budgets.requireVersion(budgetId, baseline.version)), load(v)) : null;
    return {
      budgetId,
      status: b.status,
      returned: b.returned,
      currentVersion: b.currentVersion,
      documentSha256: v.documentSha256,
      lastReturn: b.returned && lastDecision?.decision === 'returned' ? lastDecision : null,
      decisions,
      openThreads: open,
      result: {
        measurand: result.measurand,
        gum: result.gum,
        reported: reportedOf(result),
        statement: resultStatement({ symbol: result.measurand.symbol, unit: writeUnit(unitPieces(result.measurand.unit), superscript) || undefined }, result),
      },
      validation: verdictOf(result),
      warnings: result.warnings,
      evidence: this.d.attachments.evidenceOf(budgetId, b.currentVersion),
      baseline,
      changes,
      caveats: signingCaveats(open.length, result),
    };
  }

  /** In-review budgets the actor may approve: neither owned nor written by them, oldest first. */
  queue(actor: SessionUser): ReviewQueueItem[] {
    const rows = this.d.budgets.inReview().filter((r) => canApprove(actor, { ownerId: r.ownerId, status: 'in_review', isTemplate: r.isTemplate }, r.authorId));
    const counts = openThreadCounts(
      this.d.db,
      rows.map((r) => r.budgetId),
    );
    return rows.map(({ ownerId: _o, authorId: _a, isTemplate: _t, ...r }) => ({ ...r, openThreads: counts.get(r.budgetId) ?? 0 }));
  }

  /**
   * draft → in_review (owner), in_review → approved (reviewer or admin, not the
   * owner nor the version's author, password re-entered as signature),
   * in_review → draft (returned with a comment).
   */
  async transition(actor: SessionUser, budgetId: number, input: { to: TransitionTarget; comment?: string; password?: string; reason?: string }): Promise<TransitionOutput> {
    const b = this.d.budgets.requireBudget(budgetId);
    const reason = input.reason?.trim() || null;
    const illegal = () => new ConflictError(`a budget that is ${b.status.replace('_', ' ')} cannot go to ${input.to.replace('_', ' ')}`, 'invalid_transition');
    let signatureOk = false;
    if (input.to === 'in_review') {
      if (!canSubmit(actor, b)) throw new ForbiddenError('only the owner submits a budget for review');
      if (b.status !== 'draft') throw illegal();
    } else if (input.to === 'approved') {
      const v = this.d.budgets.requireVersion(budgetId, b.currentVersion);
      if (!canApprove(actor, b, v.authorId)) {
        throw new ForbiddenError(actor.role === 'reviewer' || actor.role === 'admin' ? 'nobody approves a budget they own or wrote' : 'only a reviewer or an admin approves');
      }
      if (b.status !== 'in_review') throw illegal();
      const caveats = signingCaveats(openThreads(this.d.db, budgetId).length, readStoredResult(v.result));
      if (caveats.length && !reason) {
        throw new ValidationError(`say why you approve although ${caveats.map((c) => c.message).join(', and ')}`, 'reason', 'reason_required');
      }
      if (!input.password) throw new ValidationError('re-enter your password to sign the approval', 'password');
      signatureOk = await this.d.accounts.verifySignature(actor.id, input.password, { budgetId, versionNumber: b.currentVersion });
      if (!signatureOk) throw new ForbiddenError('the password does not match; the approval was not signed', 'signature_rejected');
    } else {
      if (!canReturn(actor, b)) throw new ForbiddenError('only a reviewer or an admin other than the owner returns a budget');
      if (b.status !== 'in_review') throw illegal();
      if (!input.comment?.trim()) throw new ValidationError('say why the budget is returned', 'comment');
    }

    const out = inTransaction(this.d.db, (tx) => {
      const now = this.d.budgets.requireUnchanged(b, tx);
      const at = Date.now();
      const n = now.currentVersion;
      // the state the decision was taken in, judged again inside the transaction
      const open = openThreads(tx, budgetId).length;
      const stored = readStoredResult(this.d.budgets.requireVersion(budgetId, n, tx).result);
      const verdict = verdictOf(stored)?.verdict ?? null;
      // a thread opened since the check above still needs its reason
      if (input.to === 'approved' && !reason && signingCaveats(open, stored).length) {
        throw new ValidationError('a comment thread was opened meanwhile; look at it and say why you approve', 'reason', 'reason_required');
      }
      let signature: Record<string, unknown> = {};
      if (input.to === 'in_review') {
        this.d.budgets.setReviewStatus(tx, budgetId, { status: 'in_review', returned: false }, at);
      } else if (input.to === 'approved' && signatureOk) {
        this.d.budgets.approveVersion(tx, budgetId, n, actor.id, at);
        insertDecision(tx, { budgetId, versionNumber: n, decision: 'approved', actorId: actor.id, reason, openThreads: open, validationVerdict: verdict, at });
        signature = { reason, openThreads: open, validationVerdict: verdict, evidence: this.evidenceHashes(tx, budgetId, n) };
      } else {
        this.d.budgets.setReviewStatus(tx, budgetId, { status: 'draft', returned: true }, at);
        insertDecision(tx, { budgetId, versionNumber: n, decision: 'returned', actorId: actor.id, reason: input.comment!.trim(), openThreads: open, validationVerdict: verdict, at });
      }
      if (input.comment?.trim()) {
        insertComment(tx, { budgetId, versionNumber: n, symbol: null, authorId: actor.id, body: input.comment.trim(), at });
      }
      const action = input.to === 'in_review' ? 'budget.submitted' : input.to === 'approved' ? 'budget.approved' : 'budget.returned';
      this.d.audit.record(tx, {
        actorId: actor.id,
        action,
        budgetId,
        versionNumber: n,
        at,
        detail: {
          from: now.status,
          to: input.to,
          ...(input.comment ? { comment: input.comment.trim() } : {}),
          ...(signatureOk ? { signedBy: actor.email, ...signature } : {}),
        },
      });
      return { status: (input.to === 'draft' ? 'draft' : input.to) as BudgetStatus, version: n, returned: input.to === 'draft' };
    });

    this.notify(actor, b, input.to, out.version, input.comment);
    return out;
  }

  /** The evidence a signature covers, by file name and SHA-256. */
  private evidenceHashes(db: DbLike, budgetId: number, n: number): { fileName: string; sha256: string }[] {
    return this.d.attachments.evidenceOf(budgetId, n, db).map((e) => ({ fileName: e.fileName, sha256: e.sha256 }));
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
