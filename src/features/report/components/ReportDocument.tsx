import type { ReactNode } from 'react';
import type { Attachment } from '../../../../shared/api/uploads';
import type { HistogramBins } from '../../../../shared/budget/result';
import { atDecimalPlace, fileSize, type Figure } from '../../../../shared/presentation/figures';
import type { ResultModel } from '../../../../shared/presentation/result-model';
import { DRAFT_MARK, isUnapproved, type VersionStatus } from '../../../../shared/presentation/status';
import { StatusBadge } from '../../../app/ui/status-badge';
import { withUnit } from '../../../../shared/presentation/units';
import { formatDateTime } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';

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

/** The files the version carries, each identified by its SHA-256 (ISO/IEC 17025 7.8.2.1). */
function EvidenceList({ files }: { files: readonly EvidenceFile[] }) {
  if (!files.length) return <p className="text-sm text-stone-600">No evidence is attached to this version.</p>;
  return (
    <>
      <p className="mb-1 text-xs text-stone-600">Files kept with this version. Each is identified by its SHA-256: a copy whose digest differs is not the file this version carries.</p>
      <ul className="flex flex-col gap-1.5" data-testid="report-evidence">
        {files.map((e) => (
          <li key={e.id} className="break-inside-avoid rounded-md border border-stone-300 px-3 py-1.5 text-xs">
            <p className="flex items-baseline justify-between gap-3">
              <span className="num break-all font-semibold text-stone-900">{e.fileName}</span>
              <span className="num whitespace-nowrap text-stone-700">{fileSize(e.size).text}</span>
            </p>
            <p className="text-stone-700">
              {e.symbol === null ? (
                'for the whole budget'
              ) : (
                <>
                  for <Sym s={e.symbol} />
                </>
              )}{' '}
              · added to version {e.versionNumber} by {e.uploaderName}, {formatDateTime(e.createdAt)}
            </p>
            <p className="break-all text-stone-600">
              SHA-256 <span className="num text-[10px] text-stone-900">{e.sha256}</span>
            </p>
          </li>
        ))}
      </ul>
    </>
  );
}

/** A print-friendly histogram: bars of the Monte Carlo values, both coverage intervals marked. */
function Histogram({ h, gum, mc, unit, place }: { h: HistogramBins; gum: [number, number]; mc: [number, number]; unit: string; place: number }) {
  const W = 640;
  const H = 200;
  const pad = { l: 8, r: 8, t: 8, b: 36 };
  const max = Math.max(...h.counts, 1);
  const lo = Math.min(h.start, gum[0], mc[0]);
  const hi = Math.max(h.start + h.width * h.counts.length, gum[1], mc[1]);
  const x = (v: number) => pad.l + ((v - lo) / (hi - lo || 1)) * (W - pad.l - pad.r);
  const y = (c: number) => H - pad.b - (c / max) * (H - pad.t - pad.b);
  const ticks = [lo, (lo + hi) / 2, hi];
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label="Histogram of the Monte Carlo values with the GUM interval (dashed) and the Monte Carlo interval (solid); the figures are in the table above">
      {h.counts.map((c, i) => {
        const x0 = x(h.start + i * h.width);
        const x1 = x(h.start + (i + 1) * h.width);
        return <rect key={i} x={x0} y={y(c)} width={Math.max(0.5, x1 - x0 - 0.3)} height={H - pad.b - y(c)} fill="#b9cada" />;
      })}
      <line x1={pad.l} x2={W - pad.r} y1={H - pad.b} y2={H - pad.b} stroke="#57534e" />
      {[gum[0], gum[1]].map((v, i) => (
        <line key={`g${i}`} x1={x(v)} x2={x(v)} y1={pad.t} y2={H - pad.b} stroke="#1f5a85" strokeWidth="2" strokeDasharray="6 4" />
      ))}
      {[mc[0], mc[1]].map((v, i) => (
        <line key={`m${i}`} x1={x(v)} x2={x(v)} y1={pad.t} y2={H - pad.b} stroke="#1c1917" strokeWidth="1.5" />
      ))}
      {ticks.map((t, i) => (
        <text key={i} x={x(t)} y={H - pad.b + 14} fontSize="11" textAnchor={i === 0 ? 'start' : i === 2 ? 'end' : 'middle'} fontFamily="JetBrains Mono, monospace" fill="#292524">
          {atDecimalPlace(t, place).text}
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
  const f = m.reported;
  const unit = m.measurand.unit;
  const u = (x: Figure) => withUnit(x, unit).text;
  const mc = m.monteCarlo;
  const draft = isUnapproved(facts.status);
  return (
    <article className="report relative flex flex-col gap-5" data-testid="report-document">
      {draft ? (
        <div aria-hidden className="report-draft-mark pointer-events-none fixed inset-0 z-10 flex items-center justify-center overflow-hidden print:fixed">
          <span className="-rotate-[32deg] select-none whitespace-nowrap text-[64px] font-bold tracking-wide text-caution-700 opacity-[0.08]">{DRAFT_MARK}</span>
        </div>
      ) : null}
      <header className="flex flex-col gap-3 border-b-2 border-stone-900 pb-3">
        <div className="flex items-start justify-between gap-4">
          <div>
            <p className="text-xs font-semibold uppercase tracking-widest text-stone-700">{facts.lab}</p>
            <h1 className="text-2xl font-semibold tracking-tight">{facts.title}</h1>
            <p className="text-sm text-stone-700">
              Measurand <span className="num">{m.measurand.symbol}</span>
              {unit.text ? ` in ${unit.text}` : ' (dimensionless)'}
              {m.measurand.description ? ` — ${m.measurand.description}` : ''}
            </p>
          </div>
          <StatusBadge status={facts.status} testId="report-status" />
        </div>
        <dl className="grid grid-cols-[8.5rem_1fr_8.5rem_1fr] gap-x-3 gap-y-0.5 text-xs">
          <Row label="Budget and version">
            <span className="num">
              budget {facts.budgetId}, version {facts.version}
              {facts.latest !== facts.version ? ` (latest is ${facts.latest})` : ' (latest)'}
            </span>
          </Row>
          <Row label="Procedure">{facts.procedure ?? '—'}</Row>
          <Row label="Saved by">
            {facts.author}, {facts.savedAt}
          </Row>
          <Row label="Equipment">{facts.equipment.length ? <span className="num">{facts.equipment.join(', ')}</span> : '—'}</Row>
          <Row label="Approved by">{facts.reviewer && facts.approvedAt ? `${facts.reviewer}, ${facts.approvedAt}` : 'not approved'}</Row>
          <Row label="Environment">{facts.environment ?? '—'}</Row>
          <Row label="Change note">{facts.note || '—'}</Row>
          <Row label="Coverage probability">
            <span className="num">{f.coverageProbability.text}</span>
          </Row>
          <Row label="Engine">
            <span className="num">{facts.engineVersion}</span>
          </Row>
          <Row label="Monte Carlo">{mc ? `${mc.heading}, seed ${mc.seed}` : 'not run'}</Row>
          <Row label="Document SHA-256">
            <span className="num break-all text-[10px]">{facts.documentSha256}</span>
          </Row>
        </dl>
      </header>

      {draft ? (
        <p className="rounded-md border-2 border-caution-500 bg-caution-50 px-3 py-2 text-sm font-semibold text-caution-700">⚠ {DRAFT_MARK}: this version has not been signed by a reviewer.</p>
      ) : null}

      <section aria-labelledby="rep-result" className="break-inside-avoid">
        <h2 id="rep-result" className="mb-1 text-base font-semibold">
          1 Result
        </h2>
        <div className="rounded-md border-l-4 border-accent-600 bg-stone-50 px-3 py-2">
          <p className="text-sm leading-relaxed" data-testid="report-statement">
            {m.statement.text}
          </p>
          <dl className="num mt-2 grid grid-cols-[auto_1fr_auto_1fr] gap-x-3 gap-y-0.5 border-t border-stone-300 pt-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr_auto_1fr] [&_dd]:whitespace-nowrap" data-testid="report-figures">
            <Row label={m.measurand.symbol}>{u(f.estimate)}</Row>
            <Row label="u_c">{u(f.standardUncertainty)}</Row>
            <Row label="ν_eff">{f.effectiveDof.text}</Row>
            {f.coverageFactor ? <Row label="k">{f.coverageFactor.text}</Row> : null}
            <Row label="U">{u(f.expandedUncertainty)}</Row>
            <Row label="p">{f.coverageProbability.text}</Row>
          </dl>
          <p className="mt-1 text-xs text-stone-600">U from {f.basisWords}.</p>
          {f.notes.map((n) => (
            <p key={n} className="mt-1 text-xs font-medium text-caution-700">
              ⚠ {n}
            </p>
          ))}
        </div>
        {f.secondOrder ? <p className="mt-1 text-xs text-stone-700">With the second-order terms of the Taylor series (GUM 5.1.2, note) the combined standard uncertainty is {u(f.secondOrder)}.</p> : null}
      </section>

      <section aria-labelledby="rep-model" className="break-inside-avoid">
        <h2 id="rep-model" className="mb-1 text-base font-semibold">
          2 Measurement model
        </h2>
        <div className="grid gap-x-6 rounded-md bg-stone-50 px-3 py-2 sm:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <pre className="num whitespace-pre-wrap text-sm">{m.model.text}</pre>
          {m.model.intermediates.length ? (
            <ul className="num text-sm text-stone-600">
              {m.model.intermediates.map((q) => (
                <li key={q.symbol}>
                  {q.symbol} = {q.value.text}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
        {m.constants.length ? (
          <ul className="mt-1 text-xs text-stone-700">
            {m.constants.map((k) => (
              <li key={k.text}>{k.text}</li>
            ))}
          </ul>
        ) : null}
      </section>

      <section aria-labelledby="rep-budget">
        <h2 id="rep-budget" className="mb-1 text-base font-semibold">
          3 Uncertainty budget and ranked contributions
        </h2>
        <div className="report-table flex flex-col gap-3">{renderBudgetTable(m)}</div>
        <p className="mt-1 text-xs text-stone-600">{m.budget.method.text}</p>
      </section>

      {mc ? (
        <section aria-labelledby="rep-mc" className="break-inside-avoid">
          <h2 id="rep-mc" className="mb-1 text-base font-semibold">
            4 Monte Carlo propagation of distributions (JCGM 101:2008)
          </h2>
          <table className="w-full text-sm" data-testid="report-monte-carlo">
            <caption className="sr-only">GUM and Monte Carlo figures side by side</caption>
            <thead className="text-xs">
              <tr className="border-b border-stone-300">
                <th className="py-1 text-left font-normal text-stone-600">{unit.text ? `values in ${unit.text}` : 'dimensionless values'}</th>
                <th className="py-1 text-right font-semibold">GUM</th>
                <th className="py-1 text-right font-semibold">Monte Carlo ({mc.heading})</th>
              </tr>
            </thead>
            <tbody className="num">
              {mc.rows.map((r) => (
                <tr key={r.label} className="border-b border-stone-100">
                  <th scope="row" className="py-0.5 text-left font-sans font-normal text-stone-700">
                    {r.label}
                  </th>
                  <td className="py-0.5 text-right">{r.gum ? r.gum.text : '—'}</td>
                  <td className="py-0.5 text-right">{r.monteCarlo.text}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {mc.stability ? <p className="mt-1 text-xs text-stone-700">{mc.stability}</p> : null}
          {m.validation ? (
            <p className={`mt-2 text-sm ${m.validation.tone === 'warning' ? 'text-caution-700' : 'text-stone-800'}`} data-testid="report-verdict">
              <span className="font-semibold">{m.validation.headline}</span> {m.validation.detail.text}
            </p>
          ) : null}
          {histogram ? <Histogram h={histogram.bins} gum={histogram.gum} mc={histogram.mc} unit={unit.text} place={mc.place} /> : null}
        </section>
      ) : null}

      {m.warnings.length ? (
        <section aria-labelledby="rep-warn" className="break-inside-avoid">
          <h2 id="rep-warn" className="mb-1 text-base font-semibold">
            Warnings
          </h2>
          <ul className="ml-4 list-disc text-sm text-caution-700">
            {m.warnings.map((w, i) => (
              <li key={i}>{w}</li>
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

      <section aria-labelledby="rep-sign" className="break-inside-avoid">
        <h2 id="rep-sign" className="sr-only">
          Signatures
        </h2>
        <p className="rounded-md border border-stone-300 px-3 py-2 text-xs text-stone-800">{m.caution}</p>
        <div className="grid grid-cols-2 gap-8 pt-6 text-xs">
          {[
            ['Prepared by', facts.author, facts.savedAt],
            ['Approved by', facts.reviewer ?? '', facts.approvedAt ? `${facts.approvedAt} (signed with password)` : ''],
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

      {m.observations.length || m.correlations ? (
        <section aria-labelledby="rep-appendix" className="break-before-page">
          <h2 id="rep-appendix" className="mb-1 text-base font-semibold">
            Appendix
          </h2>
          {m.observations.map((o) => (
            <div key={o.symbol} className="mb-2 break-inside-avoid text-sm">
              <p className="font-semibold">
                <span className="num">{o.symbol}</span>
                {o.unit.text ? ` in ${o.unit.text}` : ''}, {o.values.length} readings
              </p>
              <p className="num text-stone-800">{o.values.map((v) => v.text).join(',  ')}</p>
            </div>
          ))}
          {m.correlations ? (
            <table className="num mt-2 break-inside-avoid text-sm" data-testid="report-correlations">
              <caption className="mb-1 text-left font-sans font-semibold">Correlation coefficients r(xᵢ, xⱼ)</caption>
              <thead>
                <tr>
                  <th>
                    <span className="sr-only">Input</span>
                  </th>
                  {m.correlations.symbols.map((s) => (
                    <th key={s} className="px-2 text-right">
                      {s}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {m.correlations.matrix.map((row, i) => (
                  <tr key={i}>
                    <th scope="row" className="pr-2 text-left">
                      {m.correlations!.symbols[i]}
                    </th>
                    {row.map((f, j) => (
                      <td key={j} className={`px-2 text-right ${i === j ? 'text-stone-400' : ''}`}>
                        {f.text}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
        </section>
      ) : null}
    </article>
  );
}
