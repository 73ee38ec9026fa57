import type { HistogramBins } from '../../../../shared/budget/result';
import type { ResultModel } from '../../../../shared/presentation/result-model';
import { DRAFT_MARK, isUnapproved } from '../../../../shared/presentation/status';
import type { EvidenceFile, RenderBudgetTable, ReportFacts } from '../report-facts';
import { ReportAppendix, ReportSignatures } from './ReportClosing';
import { EvidenceList } from './ReportEvidence';
import { ReportMonteCarlo } from './ReportMonteCarlo';
import { ReportModel, ReportResult } from './ReportResult';
import { ReportTitleBlock } from './ReportTitleBlock';

/** The filed report of one version, from the result model: what the PDF prints, on screen and in print. */
export function ReportDocument({
  model: m,
  facts,
  histogram,
  renderBudgetTable,
  evidence,
}: {
  model: ResultModel;
  facts: ReportFacts;
  histogram?: { bins: HistogramBins; gum: [number, number]; mc: [number, number] };
  renderBudgetTable: RenderBudgetTable;
  evidence: readonly EvidenceFile[];
}) {
  const draft = isUnapproved(facts.status);
  return (
    <article className="report relative flex flex-col gap-5" data-testid="report-document">
      {draft ? (
        <div aria-hidden className="report-draft-mark pointer-events-none fixed inset-0 z-10 flex items-center justify-center overflow-hidden print:fixed">
          <span className="-rotate-[32deg] select-none whitespace-nowrap text-[64px] font-bold tracking-wide text-caution-700 opacity-[0.08]">{DRAFT_MARK}</span>
        </div>
      ) : null}
      <ReportTitleBlock model={m} facts={facts} />

      {draft ? (
        <p className="rounded-md border-2 border-caution-500 bg-caution-50 px-3 py-2 text-sm font-semibold text-caution-700">⚠ {DRAFT_MARK}: this version has not been signed by a reviewer.</p>
      ) : null}

      <ReportResult model={m} />

      <ReportModel model={m} />

      <section aria-labelledby="rep-budget">
        <h2 id="rep-budget" className="mb-1 text-base font-semibold">
          3 Uncertainty budget and ranked contributions
        </h2>
        <div className="report-table flex flex-col gap-3">{renderBudgetTable(m)}</div>
        <p className="mt-1 text-xs text-stone-600">{m.budget.method.text}</p>
      </section>

      <ReportMonteCarlo model={m} histogram={histogram} />

      {m.warnings.length ? (
        <section aria-labelledby="rep-warn" className="break-inside-avoid">
          <h2 id="rep-warn" className="mb-1 text-base font-semibold">
            Warnings
          </h2>
          <ul className="ml-4 list-disc text-sm text-caution-700">
            {m.warnings.map((w, i) => (
              <li key={i}>{w.message}</li>
            ))}
          </ul>
        </section>
      ) : null}
      <section aria-labelledby="rep-evidence">
        <h2 id="rep-evidence" className="mb-1 text-base font-semibold">
          Evidence
        </h2>
        <EvidenceList files={evidence} />
      </section>

      <ReportSignatures model={m} facts={facts} />

      <ReportAppendix model={m} />
    </article>
  );
}
