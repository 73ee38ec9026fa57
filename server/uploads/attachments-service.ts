import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import type { EvidenceRef } from '../../shared/api/reviews';
import type { AddedAttachment, Attachment } from '../../shared/api/uploads';
import type { BudgetDocument } from '../../shared/budget/schema';
import { canAttach, isEditableStatus } from '../../shared/policy/policy';
import type { AuditService } from '../audit/audit-service';
import type { BudgetsService } from '../budgets/budgets-service';
import { sha256Hex } from '../budgets/canonical';
import type { Db, DbLike } from '../db/connection';
import { ConflictError, ForbiddenError, NotFoundError, UnsupportedMediaTypeError, ValidationError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import { getAttachment, insertAttachment, listAttachments } from './attachments-repository';

/** Evidence types Dubito keeps, recognised by their first bytes, not by the name or the claimed type. */
const SIGNATURES: { type: string; test(b: Buffer): boolean }[] = [
  { type: 'application/pdf', test: (b) => b.subarray(0, 5).toString('latin1') === '%PDF-' },
  { type: 'image/png', test: (b) => b.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) },
  { type: 'image/jpeg', test: (b) => b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff },
  { type: 'image/webp', test: (b) => b.subarray(0, 4).toString('latin1') === 'RIFF' && b.subarray(8, 12).toString('latin1') === 'WEBP' },
];
const ATTACHMENT_TYPES = SIGNATURES.map((s) => s.type);

function sniffType(b: Buffer): string | null {
  return SIGNATURES.find((s) => s.test(b))?.type ?? null;
}

export interface UploadedFile {
  originalname: string;
  mimetype: string;
  buffer: Buffer;
  size: number;
}

export interface AttachmentsDeps {
  db: Db;
  budgets: BudgetsService;
  audit: AuditService;
  dataDir: string;
}

export class AttachmentsService {
  constructor(private readonly d: AttachmentsDeps) {}

  private pathOf(sha: string): string {
    return join(this.d.dataDir, 'attachments', sha.slice(0, 2), sha);
  }

  /** The evidence of a version (the current one by default). */
  list(budgetId: number, version?: number): Attachment[] {
    const b = this.d.budgets.requireBudget(budgetId);
    const n = version ?? b.currentVersion;
    if (n > b.currentVersion) throw new NotFoundError(`budget ${budgetId} has no version ${n}`);
    return listAttachments(this.d.db, budgetId, n);
  }

  /** The evidence version `n` carries (what was added to it or an earlier version), read inside the caller's transaction when one is given. */
  evidenceOf(budgetId: number, n: number, db: DbLike = this.d.db): EvidenceRef[] {
    return listAttachments(db, budgetId, n).map((a) => ({ id: a.id, fileName: a.fileName, symbol: a.symbol, sha256: a.sha256, versionNumber: a.versionNumber }));
  }

  /**
   * Evidence is part of the version it is added to. An approved version never
   * changes, so evidence for it starts a new draft version (same document and
   * result) that carries the file; a budget in review is frozen and takes none.
   * A symbol must name an input quantity of the version.
   */
  add(actor: SessionUser, budgetId: number, file: UploadedFile | undefined, symbol: string | null): AddedAttachment {
    const b = this.d.budgets.requireBudget(budgetId);
    if (!canAttach(actor, b)) throw new ForbiddenError('only those who may edit this budget attach evidence');
    if (!isEditableStatus(b.status)) throw new ConflictError('the budget is in review; evidence can be added once it is approved or returned', 'in_review');
    if (symbol !== null) this.checkSymbol(budgetId, b.currentVersion, symbol);
    if (!file) throw new ValidationError('send the file in the "file" field', 'file');
    if (file.size === 0) throw new ValidationError('the file is empty', 'file');
    const sniffed = sniffType(file.buffer);
    if (!sniffed) throw new UnsupportedMediaTypeError(`only ${ATTACHMENT_TYPES.join(', ')} files are kept as evidence`, 'file');
    if (file.mimetype !== sniffed && file.mimetype !== 'application/octet-stream') {
      throw new UnsupportedMediaTypeError(`the file claims to be ${file.mimetype} but its content is ${sniffed}`, 'file');
    }
    const sha = sha256Hex(file.buffer);
    const target = this.pathOf(sha);
    if (!existsSync(target)) {
      mkdirSync(join(this.d.dataDir, 'attachments', sha.slice(0, 2)), { recursive: true });
      const tmp = `${target}.${randomBytes(6).toString('hex')}.tmp`;
      try {
        writeFileSync(tmp, file.buffer, { flush: true });
        renameSync(tmp, target);
      } catch (e) {
        // A full disk leaves a partial file behind; the error handler says what happened.
        rmSync(tmp, { force: true });
        throw e;
      }
    }
    // eslint-disable-next-line no-control-regex -- control characters are what the stored file name must not contain
    const fileName = file.originalname.replace(/[\\/\u0000-\u001f]/g, '_').slice(0, 255) || 'evidence';
    return this.d.budgets.addToCurrentVersion(actor, b, `evidence added: ${fileName}`, (tx, { number: n, isNew: newVersion, at }) => {
      const id = insertAttachment(tx, { budgetId, versionNumber: n, symbol, fileName, size: file.size, sha256: sha, mediaType: sniffed, uploadedBy: actor.id, createdAt: at });
      this.d.audit.record(tx, {
        actorId: actor.id,
        action: 'attachment.added',
        budgetId,
        versionNumber: n,
        at,
        detail: { attachmentId: id, fileName, sha256: sha, size: file.size, symbol, ...(newVersion ? { newVersion: true } : {}) },
      });
      return { ...getAttachment(tx, budgetId, id)!, newVersion };
    });
  }

  private checkSymbol(budgetId: number, version: number, symbol: string): void {
    const doc = JSON.parse(this.d.budgets.requireVersion(budgetId, version).document) as BudgetDocument;
    const inputs = doc.inputs.map((q) => q.symbol);
    if (!inputs.includes(symbol)) {
      throw new ValidationError(`"${symbol}" is not an input quantity of version ${version}; attach to one of ${inputs.join(', ')} or to the whole budget`, 'symbol');
    }
  }

  file(budgetId: number, id: number): { row: Attachment; path: string } {
    this.d.budgets.requireBudget(budgetId);
    const row = getAttachment(this.d.db, budgetId, id);
    if (!row) throw new NotFoundError('no such attachment');
    const path = this.pathOf(row.sha256);
    if (!existsSync(path)) throw new NotFoundError('the stored file is missing');
    return { row, path };
  }
}
