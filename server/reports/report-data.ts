import type { Attachment } from '../../shared/api/uploads';
import type { BudgetResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import type { VersionStatus } from '../../shared/policy/version-status';

/** Everything the report shows, gathered by the service; the renderer reads nothing else. */
export interface ReportData {
  lab: string;
  budgetId: number;
  title: string;
  procedure: string | null;
  version: {
    number: number;
    /** The budget's current version when the report was made. */
    latest: number;
    createdAt: number;
    note: string;
    seed: string;
    engineVersion: string;
    documentSha256: string;
    status: VersionStatus;
    author: string;
    reviewer: string | null;
    approvedAt: number | null;
  };
  document: BudgetDocument;
  result: BudgetResult;
  /** The files the version carries (added to it or to an earlier version), oldest first (ISO/IEC 17025 7.8.2.1). */
  evidence: ReportEvidence[];
  generatedAt: number;
}

/** One evidence file as the report lists it: its input symbol (null for the whole budget), size in bytes and SHA-256. */
type ReportEvidence = Pick<Attachment, 'fileName' | 'symbol' | 'size' | 'sha256' | 'versionNumber' | 'uploaderName' | 'createdAt'>;
