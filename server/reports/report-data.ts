import type { BudgetResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import type { VersionStatus } from '../../shared/policy/version-status';


export { STATUS_WORDS, type VersionStatus } from '../../shared/presentation/status';

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
  generatedAt: number;
}
