import type { ResultModel } from '../../../../shared/presentation/result-model';
import { StatusBadge } from '../../../budget/components/StatusBadge';
import type { ReportFacts } from '../report-facts';
import { Row } from './ReportRow';

/** The title block: the lab, the budget, the measurand and the facts of the version (who, when, with what). */
export function ReportTitleBlock({ model: m, facts }: { model: ResultModel; facts: ReportFacts }) {
  const unit = m.measurand.unit;
  const f = m.reported;
  const mc = m.monteCarlo;
  return (
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
  );
}
