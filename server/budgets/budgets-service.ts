import type { BudgetListItem, BudgetSummary, BudgetView, ClonedBudget, CreatedBudget, SavedVersion, VersionMeta, VersionView } from '../../shared/api/budgets';
import type { BudgetDiff } from '../../shared/api/diff';
import { validateBudget } from '../../shared/budget/budget-file';
import { DEFAULTS } from '../../shared/budget/limits';
import type { BudgetResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import { readStoredResult } from '../../shared/budget/stored-result';
import type { ComputeSupervisor } from '../compute/supervisor';
import { canEditBudget, isEditableStatus } from '../../shared/policy/policy';
import type { AuditService } from '../audit/audit-service';
import { inTransaction, type Db, type DbLike } from '../db/connection';
import { ConflictError, ForbiddenError, NotFoundError, UnprocessableError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import {
  countBudgets,
  getBudget,
  getCurrentVersion,
  getVersion,
  getVersionNamed,
  insertBudget,
  insertVersion,
  listBudgets,
  listInReview,
  listVersions,
  recordApproval,
  updateBudget,
  type BudgetFilter,
  type BudgetRow,
  type CurrentVersionRow,
  type InReviewRow,
  type VersionRow,
} from './budgets-repository';
import { documentSha256 } from './canonical';
import { checkDocumentShape } from './document-limits';
import { fileStem } from './file-name';

export type { BudgetRow, VersionRow };

/** What the supervisor does for budgets: compute and compare off the main thread, one user's jobs counted together. */
export type Computer = Pick<ComputeSupervisor, 'compute' | 'run'>;

function summary(b: BudgetRow): BudgetSummary {
  return {
    id: b.id,
    title: b.title,
    status: b.status,
    returned: b.returned,
    isTemplate: b.isTemplate,
    ownerId: b.ownerId,
    currentVersion: b.currentVersion,
    approvedVersion: b.approvedVersion,
    source: b.sourceBudgetId ? { budgetId: b.sourceBudgetId, version: b.sourceVersion } : null,
    createdAt: b.createdAt,
    updatedAt: b.updatedAt,
  };
}

/** A user's name as payloads show it; an id without a row (never expected) stays visible as such. */
const nameOr = (name: string | null, id: number) => name ?? `user ${id}`;

function metaNamed(v: VersionRow, authorName: string | null, approverName: string | null): VersionMeta {
  return {
    number: v.number,
    authorId: v.authorId,
    authorName: nameOr(authorName, v.authorId),
    createdAt: v.createdAt,
    note: v.note,
    seed: v.seed,
    engineVersion: v.engineVersion,
    documentSha256: v.documentSha256,
    approvedBy: v.approvedBy,
    approverName: v.approvedBy === null ? null : nameOr(approverName, v.approvedBy),
    approvedAt: v.approvedAt,
  };
}

interface Computed {
  document: BudgetDocument;
  text: string;
  sha: string;
  result: BudgetResult;
}

/** What a stored version holds besides its number, author and note. */
interface VersionContent {
  title: string;
  document: string;
  result: string;
  seed: string;
  engineVersion: string;
  documentSha256: string;
}

/** A computed document as a version stores it; the seed is the one the Monte Carlo run used. */
function contentOf(c: Computed): VersionContent {
  return {
    title: c.document.title,
    document: c.text,
    result: JSON.stringify(c.result),
    seed: String(c.result.monteCarlo?.seed ?? c.document.monteCarlo?.seed ?? DEFAULTS.seed),
    engineVersion: c.result.engineVersion,
    documentSha256: c.sha,
  };
}

/** A stored version's content, carried unchanged into a new version. */
function copyOf(v: VersionRow, title: string): VersionContent {
  return { title, document: v.document, result: v.result, seed: v.seed, engineVersion: v.engineVersion, documentSha256: v.documentSha256 };
}

export class BudgetsService {
  constructor(
    private readonly db: Db,
    private readonly computer: Computer,
    private readonly audit: AuditService,
    private readonly limits: { diffMaxBytes: number } = { diffMaxBytes: Infinity },
  ) {}

  /** Checks the shape, validates and computes a document for `actor`; a version is never stored without its result. */
  private async computeDocument(value: unknown, actor: SessionUser): Promise<Computed> {
    checkDocumentShape(value);
    const document = validateBudget(value);
    const result = await this.computer.compute(document, actor.id);
    return { document, text: JSON.stringify(document), sha: documentSha256(document), result };
  }

  /**
   * The one way a version is stored, inside the caller's transaction: the version after `before`'s
   * current one is written, the budget points at it as a draft under the document's title, and the
   * audit event records it with the document's SHA-256 and the note. Returns the new number.
   */
  private storeVersion(tx: DbLike, before: BudgetRow, author: SessionUser, note: string, content: VersionContent, at: number, event: { action: string; detail: Record<string, unknown> }): number {
    const { title, ...stored } = content;
    const n = before.currentVersion + 1;
    insertVersion(tx, { budgetId: before.id, number: n, authorId: author.id, createdAt: at, note, ...stored });
    updateBudget(tx, before.id, { currentVersion: n, title, status: 'draft', updatedAt: at });
    this.audit.record(tx, {
      actorId: author.id,
      action: event.action,
      budgetId: before.id,
      versionNumber: n,
      at,
      detail: { ...event.detail, documentSha256: content.documentSha256, note },
    });
    return n;
  }

  /** A budget, or undefined; read inside the caller's transaction when one is given. */
  findBudget(id: number, db: DbLike = this.db): BudgetRow | undefined {
    return getBudget(db, id);
  }

  /** The budget, read inside the caller's transaction when one is given; 404 without it. */
  requireBudget(id: number, db: DbLike = this.db): BudgetRow {
    const b = getBudget(db, id);
    if (!b) throw new NotFoundError('no such budget');
    return b;
  }

  /**
   * The budget as it is inside the caller's transaction; 409 `stale_version` when its version or
   * status moved since `seen` was read (a decision or an addition was judged on what was seen).
   */
  requireUnchanged(seen: BudgetRow, tx: DbLike, then = 'reload it'): BudgetRow {
    const now = this.requireBudget(seen.id, tx);
    if (now.currentVersion !== seen.currentVersion || now.status !== seen.status) {
      throw new ConflictError(`the budget changed meanwhile; ${then}`, 'stale_version', { currentVersion: now.currentVersion });
    }
    return now;
  }

  /** A stored version, or undefined; read inside the caller's transaction when one is given. */
  findVersion(id: number, n: number, db: DbLike = this.db): VersionRow | undefined {
    return getVersion(db, id, n);
  }

  /** A stored version; 404 without it. */
  requireVersion(id: number, n: number, db: DbLike = this.db): VersionRow {
    const v = this.findVersion(id, n, db);
    if (!v) throw new NotFoundError(`budget ${id} has no version ${n}`);
    return v;
  }

  /** Budgets in review with their current version's author, the longest waiting first. */
  inReview(): InReviewRow[] {
    return listInReview(this.db);
  }

  /** How many budgets there are, templates included. */
  count(): number {
    return countBudgets(this.db);
  }

  list(filter: BudgetFilter): BudgetListItem[] {
    return listBudgets(this.db, filter);
  }

  /** One page of the list and how many budgets match the filter in all. */
  page(filter: BudgetFilter): { rows: BudgetListItem[]; total: number } {
    return { rows: listBudgets(this.db, filter), total: countBudgets(this.db, filter) };
  }

  /** The budget with its current version and names, in one query. */
  private current(id: number): CurrentVersionRow {
    const row = getCurrentVersion(this.db, id);
    if (!row) throw new NotFoundError('no such budget');
    return row;
  }

  private head({ budget: b, version: v, ownerName, authorName, approverName }: CurrentVersionRow): Omit<BudgetView, 'document' | 'result'> {
    return { ...summary(b), ownerName: nameOr(ownerName, b.ownerId), version: metaNamed(v, authorName, approverName) };
  }

  get(id: number): BudgetView {
    const row = this.current(id);
    return { ...this.head(row), document: JSON.parse(row.version.document) as BudgetDocument, result: readStoredResult(row.version.result) };
  }

  /**
   * The same view as `get`, as JSON text: the stored document and result are
   * spliced in as they are, without parsing them (the hot read path).
   */
  getJson(id: number): string {
    const row = this.current(id);
    const head = JSON.stringify(this.head(row));
    return `${head.slice(0, -1)},"document":${row.version.document},"result":${row.version.result}}`;
  }

  /** Bytes of a stored version's document and result text (what a report or a diff would read). */
  storedBytes(id: number, n: number): number {
    const v = this.requireVersion(id, n);
    return Buffer.byteLength(v.document) + Buffer.byteLength(v.result);
  }

  /** One page of a budget's versions (numbered 1…current, so the current number is their count). */
  versionsPage(id: number, page: { limit: number; offset: number; order: 'asc' | 'desc' }): { rows: VersionMeta[]; total: number } {
    const b = this.requireBudget(id);
    return { rows: listVersions(this.db, id, page), total: b.currentVersion };
  }

  version(id: number, n: number): VersionView {
    this.requireBudget(id);
    const named = getVersionNamed(this.db, id, n);
    if (!named) throw new NotFoundError(`budget ${id} has no version ${n}`);
    const v = named.version;
    return { budgetId: id, ...metaNamed(v, named.authorName, named.approverName), document: JSON.parse(v.document) as BudgetDocument, result: readStoredResult(v.result) };
  }

  /** The difference of two versions, computed in a worker; versions larger together than `diffMaxBytes` are refused. */
  async diff(actor: SessionUser, id: number, from: number, to: number): Promise<BudgetDiff> {
    this.requireBudget(id);
    const a = this.requireVersion(id, from);
    const b = this.requireVersion(id, to);
    const bytes = [a.document, a.result, b.document, b.result].reduce((n, t) => n + Buffer.byteLength(t), 0);
    if (bytes > this.limits.diffMaxBytes) {
      throw new UnprocessableError(
        'too_large_to_compare',
        `versions ${from} and ${to} take ${bytes} bytes together, more than the ${this.limits.diffMaxBytes} a comparison may read; export both versions and compare the files instead`,
      );
    }
    const text = (v: VersionRow) => ({ number: v.number, document: v.document, result: v.result });
    return this.computer.run('diff', { from: text(a), to: text(b) }, actor.id);
  }

  async create(actor: SessionUser, input: { document: unknown; note: string; template?: boolean }, action = 'budget.created'): Promise<CreatedBudget> {
    if (input.template && actor.role !== 'admin') throw new ForbiddenError('only admins create templates');
    const c = await this.computeDocument(input.document, actor);
    const at = Date.now();
    const id = inTransaction(this.db, (tx) => {
      const b = insertBudget(tx, { title: c.document.title, ownerId: actor.id, isTemplate: !!input.template }, at);
      this.storeVersion(tx, b, actor, input.note, contentOf(c), at, { action, detail: { title: c.document.title, template: !!input.template } });
      return b.id;
    });
    return { id, version: 1, result: c.result };
  }

  private checkEditable(actor: SessionUser, b: BudgetRow, baseVersion: number): void {
    if (!canEditBudget(actor, b)) {
      throw new ForbiddenError(b.isTemplate ? 'only admins edit templates' : actor.role === 'trainee' && b.ownerId === actor.id ? 'trainees edit drafts only' : 'only the owner edits this budget');
    }
    if (!isEditableStatus(b.status)) throw new ConflictError('the budget is in review; it can be edited once approved or returned', 'in_review');
    if (b.currentVersion !== baseVersion) {
      throw new ConflictError(`version ${baseVersion} is not the current version (${b.currentVersion}); reload and merge your changes`, 'stale_version', {
        currentVersion: b.currentVersion,
      });
    }
  }

  /** Saves a new version on top of `baseVersion`; 409 if someone saved in between. Saving an approved budget starts a new draft. */
  async save(actor: SessionUser, id: number, input: { baseVersion: number; document: unknown; note: string }): Promise<SavedVersion> {
    this.checkEditable(actor, this.requireBudget(id), input.baseVersion);
    const c = await this.computeDocument(input.document, actor);
    const at = Date.now();
    const number = inTransaction(this.db, (tx) => {
      const b = this.requireBudget(id, tx);
      this.checkEditable(actor, b, input.baseVersion);
      return this.storeVersion(tx, b, actor, input.note, contentOf(c), at, { action: 'budget.version_saved', detail: { statusBefore: b.status } });
    });
    return { version: number, result: c.result };
  }

  setTemplate(actor: SessionUser, id: number, isTemplate: boolean): BudgetSummary {
    return inTransaction(this.db, (tx) => {
      const b = this.requireBudget(id, tx);
      if (b.isTemplate !== isTemplate) {
        updateBudget(tx, id, { isTemplate, updatedAt: Date.now() });
        this.audit.record(tx, { actorId: actor.id, action: 'budget.template_changed', budgetId: id, detail: { isTemplate } });
      }
      return summary(this.requireBudget(id, tx));
    });
  }

  /** A new draft owned by the caller, recording where it came from. */
  async clone(actor: SessionUser, id: number, input: { version?: number; title?: string }): Promise<ClonedBudget> {
    const source = this.requireBudget(id);
    const n = input.version ?? source.currentVersion;
    const v = this.requireVersion(id, n);
    const doc = JSON.parse(v.document) as BudgetDocument;
    if (input.title) doc.title = input.title;
    const c = await this.computeDocument(doc, actor);
    const at = Date.now();
    const newId = inTransaction(this.db, (tx) => {
      const b = insertBudget(tx, { title: c.document.title, ownerId: actor.id, isTemplate: false, sourceBudgetId: id, sourceVersion: n }, at);
      const note = `cloned from ${source.isTemplate ? 'template' : 'budget'} ${id}, version ${n}`;
      this.storeVersion(tx, b, actor, note, contentOf(c), at, { action: 'budget.cloned', detail: { sourceBudgetId: id, sourceVersion: n } });
      return b.id;
    });
    return { id: newId, version: 1 };
  }

  /**
   * Runs `write` in one transaction on the version that takes an addition (evidence): the current
   * version, or, when it is approved and so never changes, a new draft version carrying the same
   * document and result with `note`. Refuses with 409 when the budget changed since `seen` was read.
   */
  addToCurrentVersion<T>(actor: SessionUser, seen: BudgetRow, note: string, write: (tx: DbLike, version: { number: number; isNew: boolean; at: number }) => T): T {
    return inTransaction(this.db, (tx) => {
      const now = this.requireUnchanged(seen, tx, 'reload it and attach the file again');
      const at = Date.now();
      const current = this.requireVersion(now.id, now.currentVersion, tx);
      const isNew = current.approvedAt !== null;
      let number = now.currentVersion;
      if (isNew) {
        number = this.storeVersion(tx, now, actor, note, copyOf(current, now.title), at, { action: 'budget.version_saved', detail: { statusBefore: now.status } });
      } else {
        updateBudget(tx, now.id, { updatedAt: at });
      }
      return write(tx, { number, isNew, at });
    });
  }

  /** Puts the budget in `status` as a review decision leaves it, inside the decision's transaction. */
  setReviewStatus(tx: DbLike, id: number, patch: { status: 'draft' | 'in_review'; returned: boolean }, at: number): void {
    updateBudget(tx, id, { ...patch, updatedAt: at });
  }

  /** Signs version `n` as approved by `approverId` and makes it the budget's approved version, inside the decision's transaction. */
  approveVersion(tx: DbLike, id: number, n: number, approverId: number, at: number): void {
    recordApproval(tx, id, n, approverId, at);
    updateBudget(tx, id, { status: 'approved', approvedVersion: n, returned: false, updatedAt: at });
  }

  exportFile(id: number, n?: number): { fileName: string; document: BudgetDocument } {
    const b = this.requireBudget(id);
    const v = this.requireVersion(id, n ?? b.currentVersion);
    const document = JSON.parse(v.document) as BudgetDocument;
    return { fileName: `${fileStem(document.title)}-v${v.number}.json`, document };
  }
}
