import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { canAttach } from '../../shared/policy/policy';
import { recordAudit } from '../audit/audit-repository';
import { getBudget } from '../budgets/budgets-repository';
import { sha256Hex } from '../budgets/canonical';
import { inTransaction, type Db } from '../db/connection';
import { ForbiddenError, NotFoundError, UnsupportedMediaTypeError, ValidationError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import { getAttachment, insertAttachment, listAttachments, type AttachmentRow } from './attachments-repository';

/** Evidence types Dubito keeps, recognised by their first bytes, not by the name or the claimed type. */
const SIGNATURES: { type: string; test(b: Buffer): boolean }[] = [
  { type: 'application/pdf', test: (b) => b.subarray(0, 5).toString('latin1') === '%PDF-' },
  { type: 'image/png', test: (b) => b.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) },
  { type: 'image/jpeg', test: (b) => b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff },
  { type: 'image/webp', test: (b) => b.subarray(0, 4).toString('latin1') === 'RIFF' && b.subarray(8, 12).toString('latin1') === 'WEBP' },
];
export const ATTACHMENT_TYPES = SIGNATURES.map((s) => s.type);

export function sniffType(b: Buffer): string | null {
  return SIGNATURES.find((s) => s.test(b))?.type ?? null;
}

export interface UploadedFile {
  originalname: string;
  mimetype: string;
  buffer: Buffer;
  size: number;
}

export class AttachmentsService {
  constructor(
    private readonly db: Db,
    private readonly dataDir: string,
  ) {}

  private pathOf(sha: string): string {
    return join(this.dataDir, 'attachments', sha.slice(0, 2), sha);
  }

  private budget(id: number) {
    const b = getBudget(this.db, id);
    if (!b) throw new NotFoundError('no such budget');
    return b;
  }

  list(budgetId: number): AttachmentRow[] {
    this.budget(budgetId);
    return listAttachments(this.db, budgetId);
  }

  add(actor: SessionUser, budgetId: number, file: UploadedFile | undefined, symbol: string | null): AttachmentRow {
    const b = this.budget(budgetId);
    if (!canAttach(actor, b)) throw new ForbiddenError('only those who may edit this budget attach evidence');
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
      mkdirSync(join(this.dataDir, 'attachments', sha.slice(0, 2)), { recursive: true });
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
    const fileName = file.originalname.replace(/[\\/\u0000-\u001f]/g, '_').slice(0, 255) || 'evidence';
    return inTransaction(this.db, (tx) => {
      const at = Date.now();
      const a = insertAttachment(tx, { budgetId, symbol, fileName, size: file.size, sha256: sha, mediaType: sniffed, uploadedBy: actor.id, createdAt: at });
      recordAudit(tx, { actorId: actor.id, action: 'attachment.added', budgetId, at, detail: { attachmentId: a.id, fileName, sha256: sha, size: file.size, symbol } });
      return a;
    });
  }

  file(budgetId: number, id: number): { row: AttachmentRow; path: string } {
    this.budget(budgetId);
    const row = getAttachment(this.db, budgetId, id);
    if (!row) throw new NotFoundError('no such attachment');
    const path = this.pathOf(row.sha256);
    if (!existsSync(path)) throw new NotFoundError('the stored file is missing');
    return { row, path };
  }
}
