import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { BudgetResult, HistogramBins } from '../../../../shared/budget/result';
import type { BudgetDocument } from '../../../../shared/budget/schema';
import { resultStatement } from '../../../../shared/gum/statement';
import { errorMessage } from '../../../app/http';
import { Button, ErrorNote, Spinner } from '../../../app/ui/controls';
import { formatCount, formatDateTime, formatDof, formatSignificant, formatUncertainty, formatWithUncertainty } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import { StatusBadge } from '../../../app/ui/status-badge';
import { versionStatus } from '../../../../shared/policy/version-status';
import { formatUnit } from '../../../app/ui/units';
import { reportPdfUrl, useReport } from '../api/report';

/** The budget table and chart of shares, drawn by the editor's components (the app passes them in). */
export type RenderBudgetTable = (result: BudgetResult, document: BudgetDocument) => ReactNode;

/** A print-friendly histogram: bars of the Monte Carlo values, both coverage intervals marked. */
function Histogram({ h, gum, mc, unit }: { h: HistogramBins; gum: [number, number]; mc: [number, number]; unit: string }) {
  const W = 640;
  const H = 200;
  const pad = { l: 8, r: 8, t: 8, b: 36 };
  const max = Math.max(...h.counts, 1);
  const lo = Math.min(h.start, gum[0], mc[0]);
  const hi = Math.max(h.start + h.width * h.counts.length, gum[1], mc[1]);
  const x = (v: number) => pad.l + ((v - lo) / (hi - lo || 1)) * (W - pad.l - pad.r);
  const y = (c: number) => H - pad.b - (c / max) * (H - pad.t - pad.b);
  const ticks = [lo, (lo + hi) / 2, hi];
  // enough digits that the three ticks differ
  const sig = Math.min(12, Math.max(3, Math.ceil(Math.log10(Math.max(Math.abs(lo), Math.abs(hi)) / ((hi - lo) / 2 || 1))) + 2));
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={`Histogram of the Monte Carlo values; coverage interval from ${formatSignificant(mc[0], 6)} to ${formatSignificant(mc[1], 6)} ${unit}`}>
      {h.counts.map((c, i) => {
        const x0 = x(h.start + i * h.width);
        const x1 = x(h.start + (i + 1) * h.width);
        return <rect key={i} x={x0} y={y(c)} width={Math.max(0.5, x1 - x0 - 0.3)} height={H - pad.b - y(c)} fill="#a8a29e" />;
      })}
      <line x1={pad.l} x2={W - pad.r} y1={H - pad.b} y2={H - pad.b} stroke="#57534e" />
      {[gum[0], gum[1]].map((v, i) => (
        <line key={`g${i}`} x1={x(v)} x2={x(v)} y1={pad.t} y2={H - pad.b} stroke="#176464" strokeWidth="2" strokeDasharray="6 4" />
      ))}
      {[mc[0], mc[1]].map((v, i) => (
        <line key={`m${i}`} x1={x(v)} x2={x(v)} y1={pad.t} y2={H - pad.b} stroke="#7c5214" strokeWidth="2" />
      ))}
      {ticks.map((t, i) => (
        <text key={i} x={x(t)} y={H - pad.b + 14} fontSize="11" textAnchor={i === 0 ? 'start' : i === 2 ? 'end' : 'middle'} fontFamily="JetBrains Mono, monospace" fill="#292524">
          {formatSignificant(t, sig)}
        </text>
      ))}
      <text x={W / 2} y={H - 4} fontSize="11" textAnchor="middle" fill="#44403c">
        {unit ? `value / ${unit}` : 'value'} · dashed: GUM interval y ± U · solid: Monte Carlo interval
      </text>
    </svg>
  );
}

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-stone-600">{label}</dt>
      <dd className="text-stone-900">{children}</dd>
    </>
  );
}

export function ReportPage({ budgetId, versionNumber, renderBudgetTable }: { budgetId: number; versionNumber: number; renderBudgetTable: RenderBudgetTable }) {
  const { version, budget } = useReport(budgetId, versionNumber);
  if (version.isPending || budget.isPending) {
    return (
      <div className="p-8">
        <Spinner label="Preparing the report" />
      </div>
    );
  }
  if (version.isError || budget.isError) {
    return (
      <div className="mx-auto max-w-xl p-8">
        <ErrorNote title="The report could not be prepared">{errorMessage(version.error ?? budget.error)}</ErrorNote>
      </div>
    );
  }
  const v = version.data;
  const b = budget.data;
  const r = v.result;
  const doc = v.document;
  const unit = formatUnit(r.measurand.unit);
  const statement = resultStatement({ symbol: r.measurand.symbol, unit: unit || undefined }, r);
  const approved = v.approvedAt !== null;
  const mc = r.monteCarlo;

  return (
    <div className="report mx-auto flex max-w-[210mm] flex-col gap-5 bg-white px-8 py-6 text-stone-900 print:max-w-none print:px-0 print:py-0">
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

      <header className="flex flex-col gap-3 border-b-2 border-stone-900 pb-3">
        <div className="flex items-start justify-between gap-4">
          <div>
            <p className="text-xs uppercase tracking-widest text-stone-600">Measurement-uncertainty budget</p>
            <h1 className="text-2xl font-semibold tracking-tight">{doc.title}</h1>
            {doc.measurand.description ? <p className="text-sm text-stone-700">{doc.measurand.description}</p> : null}
          </div>
          <div className="flex flex-col items-end gap-1 text-right">
            <p className="text-lg font-semibold">
              Dubito<span className="text-accent-600">.</span>
            </p>
            <StatusBadge status={versionStatus(b, v)} />
          </div>
        </div>
        <dl className="grid grid-cols-[8rem_1fr_8rem_1fr] gap-x-3 gap-y-0.5 text-xs">
          <Row label="Budget">
            <span className="num">#{budgetId}</span>
          </Row>
          <Row label="Version">
            <span className="num">
              {v.number}
              {b.currentVersion !== v.number ? ` (current: ${b.currentVersion})` : ''}
            </span>
          </Row>
          <Row label="Author">{v.authorName}</Row>
          <Row label="Saved">{formatDateTime(v.createdAt)}</Row>
          <Row label="Reviewer">{v.approverName ?? 'not approved'}</Row>
          <Row label="Approved">{v.approvedAt !== null ? formatDateTime(v.approvedAt) : '—'}</Row>
          <Row label="Monte Carlo seed">
            <span className="num">{mc?.seed ?? v.seed}</span>
          </Row>
          <Row label="Engine">
            <span className="num">{v.engineVersion}</span>
          </Row>
          <Row label="Document SHA-256">
            <span className="num break-all text-[10px]">{v.documentSha256}</span>
          </Row>
          <Row label="Change note">{v.note || '—'}</Row>
        </dl>
      </header>

      {!approved ? (
        <p className="rounded-md border-2 border-caution-500 bg-caution-50 px-3 py-2 text-sm font-semibold text-caution-700">⚠ Not approved: this version has not been signed by a reviewer.</p>
      ) : null}

      <section aria-labelledby="rep-result" className="break-inside-avoid">
        <h2 id="rep-result" className="mb-1 text-base font-semibold">
          Result
        </h2>
        <p className="rounded-md border border-stone-300 bg-stone-50 px-3 py-2 text-sm leading-relaxed" data-testid="report-statement">
          {statement}
        </p>
        <dl className="num mt-2 grid grid-cols-3 gap-x-4 gap-y-0.5 text-sm sm:grid-cols-6">
          <Row label="y">{formatWithUncertainty(r.gum.estimate, r.gum.expandedUncertainty)} {unit}</Row>
          <Row label="u_c">{formatUncertainty(r.gum.standardUncertainty)} {unit}</Row>
          <Row label="ν_eff">{formatDof(r.gum.effectiveDof)}</Row>
          <Row label="k">{r.gum.coverageFactor.toFixed(2)}</Row>
          <Row label="U">{formatUncertainty(r.gum.expandedUncertainty)} {unit}</Row>
          <Row label="p">{`${+(r.gum.coverageProbability * 100).toFixed(2)} %`}</Row>
        </dl>
      </section>

      <section aria-labelledby="rep-model" className="break-inside-avoid">
        <h2 id="rep-model" className="mb-1 text-base font-semibold">
          Model
        </h2>
        <pre className="num whitespace-pre-wrap rounded-md border border-stone-300 px-3 py-2 text-sm">{doc.model}</pre>
        <p className="mt-1 text-xs text-stone-700">
          Measurand <Sym s={doc.measurand.symbol} />
          {unit ? ` in ${unit}` : ''}; {doc.inputs.length} input quantities{doc.correlations?.length ? `, ${doc.correlations.length} correlated pairs` : ''}.
        </p>
      </section>

      <section aria-labelledby="rep-budget">
        <h2 id="rep-budget" className="mb-1 text-base font-semibold">
          Uncertainty budget and shares of the variance
        </h2>
        <div className="report-table flex flex-col gap-3">{renderBudgetTable(r, doc)}</div>
      </section>

      {mc ? (
        <section aria-labelledby="rep-mc" className="break-inside-avoid">
          <h2 id="rep-mc" className="mb-1 text-base font-semibold">
            Monte Carlo (JCGM 101)
          </h2>
          <p className="mb-1 text-xs text-stone-700">
            <span className="num">{formatCount(mc.trials)}</span> trials{mc.adaptive ? ' (adaptive)' : ''}, seed <span className="num">{mc.seed}</span>: y ={' '}
            <span className="num">{formatWithUncertainty(mc.estimate, mc.standardUncertainty)}</span> {unit}, u ={' '}
            <span className="num">{formatUncertainty(mc.standardUncertainty)}</span> {unit}, {`${+(r.gum.coverageProbability * 100).toFixed(2)} %`} interval [
            <span className="num">{formatSignificant(mc.interval[0], 7)}</span>, <span className="num">{formatSignificant(mc.interval[1], 7)}</span>] {unit}.
            {r.validation ? (r.validation.passed ? ' The GUM result is validated by the Monte Carlo result (JCGM 101 clause 8).' : ' The GUM result is NOT validated by the Monte Carlo result (JCGM 101 clause 8).') : ''}
          </p>
          <Histogram h={mc.histogram} gum={r.gum.interval} mc={mc.interval} unit={unit} />
        </section>
      ) : null}

      {r.warnings.length ? (
        <section aria-labelledby="rep-warn" className="break-inside-avoid">
          <h2 id="rep-warn" className="mb-1 text-base font-semibold">
            Warnings
          </h2>
          <ul className="ml-4 list-disc text-sm text-caution-700">
            {r.warnings.map((w, i) => (
              <li key={i}>{w}</li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-labelledby="rep-sign" className="break-inside-avoid">
        <h2 id="rep-sign" className="sr-only">
          Signatures
        </h2>
        <div className="grid grid-cols-2 gap-8 pt-6 text-xs">
          {[
            ['Prepared by', v.authorName, formatDateTime(v.createdAt)],
            ['Approved by', v.approverName ?? '', v.approvedAt !== null ? `${formatDateTime(v.approvedAt)} (signed with password)` : ''],
          ].map(([role, who, when]) => (
            <div key={role}>
              <div className="h-10 border-b border-stone-900" />
              <p className="mt-1 font-semibold">{role}</p>
              <p>{who || 'name'}</p>
              <p className="text-stone-600">{when || 'date'}</p>
            </div>
          ))}
        </div>
      </section>

      <footer className="border-t border-stone-300 pt-2 text-[11px] leading-snug text-stone-700">
        These results support, and do not replace, the laboratory's documented measurement procedure and the requirements of ISO/IEC 17025. Evaluation per JCGM 100:2008 (GUM)
        {mc ? ' and JCGM 101:2008 (Monte Carlo)' : ''}; figures rounded per GUM 7.2.6.
      </footer>
    </div>
  );
}
