import { can } from '../../shared/policy/policy';
import type { BudgetsService } from '../budgets/budgets-service';
import type { ComputeSupervisor } from '../compute/supervisor';
import { ForbiddenError, UnprocessableError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import type { AttachmentsService } from '../uploads/attachments-service';
import { versionStatus } from '../../shared/policy/version-status';
import { labOf } from '../../shared/presentation/status';
import type { ReportData } from './report-data';
import { reportFileName } from './report-pdf';

export interface ReportFile {
  fileName: string;
  pdf: Buffer;
}

const text = (v: unknown): string | null => (typeof v === 'string' && v.trim() ? v.trim() : null);

/** The printed report of a budget version: readable by whoever may read the budget. */
export class ReportsService {
  constructor(
    private readonly d: {
      budgets: BudgetsService;
      /** The evidence the version carries. */
      attachments: Pick<AttachmentsService, 'list'>;
      /** Builds the PDF in a worker thread, never on the event loop. */
      workers: Pick<ComputeSupervisor, 'run'>;
      /** Largest stored version (document and result text) a report is built from. */
      maxBytes: number;
      lab?: string;
      now?: () => number;
    },
  ) {}

  /** Everything the report shows; `n` defaults to the current version. */
  data(actor: SessionUser, id: number, n?: number): ReportData {
    if (!can(actor.role, 'budget.read')) throw new ForbiddenError();
    const b = this.d.budgets.requireBudget(id);
    const v = this.d.budgets.version(id, n ?? b.currentVersion);
    const doc = v.document as typeof v.document & { lab?: unknown; procedure?: unknown };
    return {
      lab: labOf(doc, this.d.lab),
      budgetId: id,
      title: v.document.title,
      procedure: text(doc.procedure),
      version: {
        number: v.number,
        latest: b.currentVersion,
        createdAt: v.createdAt,
        note: v.note,
        seed: v.seed,
        engineVersion: v.engineVersion,
        documentSha256: v.documentSha256,
        status: versionStatus(b, v),
        author: v.authorName,
        reviewer: v.approverName,
        approvedAt: v.approvedAt,
      },
      document: v.document,
      result: v.result,
      evidence: this.d.attachments.list(id, v.number).map((a) => ({
        fileName: a.fileName,
        symbol: a.symbol,
        size: a.size,
        sha256: a.sha256,
        versionNumber: a.versionNumber,
        uploaderName: a.uploaderName,
        createdAt: a.createdAt,
      })),
      generatedAt: (this.d.now ?? Date.now)(),
    };
  }

  /** The PDF, built in a worker; a version larger than `maxBytes` is refused before anything is parsed. */
  async pdf(actor: SessionUser, id: number, n?: number): Promise<ReportFile> {
    if (!can(actor.role, 'budget.read')) throw new ForbiddenError();
    const number = n ?? this.d.budgets.requireBudget(id).currentVersion;
    const bytes = this.d.budgets.storedBytes(id, number);
    if (bytes > this.d.maxBytes) {
      throw new UnprocessableError('too_large_to_report', `version ${number} takes ${bytes} bytes, more than the ${this.d.maxBytes} a report may be built from; export the budget file instead`);
    }
    const data = this.data(actor, id, number);
    const pdf = await this.d.workers.run('report', data, actor.id);
    return { fileName: reportFileName(data), pdf: Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength) };
  }
}
