import type { ReactNode } from 'react';
import type { Attachment } from '../../../shared/api/uploads';
import type { ResultModel } from '../../../shared/presentation/result-model';
import type { VersionStatus } from '../../../shared/presentation/status';

/** The budget table and ranked contributions, drawn by the editor's components (the app passes them in). */
export type RenderBudgetTable = (model: ResultModel) => ReactNode;

/** The facts of the version on paper. */
export interface ReportFacts {
  lab: string;
  budgetId: number;
  title: string;
  version: number;
  latest: number;
  status: VersionStatus;
  author: string;
  savedAt: string;
  reviewer: string | null;
  approvedAt: string | null;
  note: string;
  seed: string;
  engineVersion: string;
  documentSha256: string;
  procedure: string | null;
  equipment: string[];
  environment: string | null;
}

/** One evidence file of the version: what the PDF's evidence box prints. */
export type EvidenceFile = Pick<Attachment, 'id' | 'fileName' | 'symbol' | 'size' | 'sha256' | 'versionNumber' | 'uploaderName' | 'createdAt'>;
