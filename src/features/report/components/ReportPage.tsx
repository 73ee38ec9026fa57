import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { presentResult } from '../../../../shared/presentation/result-model';
import { labOf, versionStatus } from '../../../../shared/presentation/status';
import { errorMessage } from '../../../app/http';
import { Button, ErrorNote, Spinner } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { reportPdfUrl, useReport } from '../api/report';
import type { RenderBudgetTable } from '../report-facts';
import { ReportDocument } from './ReportDocument';

export type { RenderBudgetTable };

/** A reader's copy of one version: the same result model as the PDF, with print and download. */
export function ReportPage({ budgetId, versionNumber, renderBudgetTable }: { budgetId: number; versionNumber: number; renderBudgetTable: RenderBudgetTable }) {
  const { version, budget, evidence } = useReport(budgetId, versionNumber);
  const model = useMemo(() => (version.data ? presentResult(version.data.document, version.data.result) : null), [version.data]);
  if (version.isPending || budget.isPending || evidence.isPending) {
    return (
      <div className="p-8">
        <Spinner label="Preparing the report" />
      </div>
    );
  }
  // a report without its evidence list would be incomplete: it is not shown
  if (version.isError || budget.isError || evidence.isError || !model) {
    return (
      <div className="mx-auto max-w-xl p-8">
        <ErrorNote heading title="The report could not be prepared">
          {errorMessage(version.error ?? budget.error ?? evidence.error)}
        </ErrorNote>
      </div>
    );
  }
  const v = version.data;
  const b = budget.data;
  const doc = v.document;
  const mc = v.result.monteCarlo;
  return (
    <div className="mx-auto flex max-w-[210mm] flex-col gap-5 bg-white px-8 py-6 text-stone-900 print:max-w-none print:px-0 print:py-0">
      <div className="no-print flex flex-wrap items-center gap-2 rounded-md border border-stone-200 bg-stone-50 px-3 py-2 text-sm">
        <Link to={`/budgets/${budgetId}/versions`} className="text-accent-700 hover:underline">
          ‹ Versions
        </Link>
        <span className="flex-1" />
        <Button onClick={() => window.print()}>Print</Button>
        <a href={reportPdfUrl(budgetId, versionNumber)} download className="inline-flex items-center rounded-md bg-accent-600 px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-700">
          Download PDF
        </a>
      </div>
      <ReportDocument
        model={model}
        renderBudgetTable={renderBudgetTable}
        evidence={evidence.data}
        histogram={mc ? { bins: mc.histogram, gum: v.result.gum.interval, mc: mc.interval } : undefined}
        facts={{
          lab: labOf(doc),
          budgetId,
          title: doc.title,
          version: v.number,
          latest: b.currentVersion,
          status: versionStatus(b, v),
          author: v.authorName,
          savedAt: formatDateTime(v.createdAt),
          reviewer: v.approverName,
          approvedAt: v.approvedAt !== null ? formatDateTime(v.approvedAt) : null,
          note: v.note,
          seed: v.seed,
          engineVersion: v.engineVersion,
          documentSha256: v.documentSha256,
          procedure: doc.procedure?.trim() || null,
          equipment: (doc.equipment ?? []).map((e) => e.trim()).filter(Boolean),
          environment: doc.environment?.trim() || null,
        }}
      />
    </div>
  );
}
