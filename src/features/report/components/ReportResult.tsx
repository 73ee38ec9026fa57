import type { Figure } from '../../../../shared/presentation/figures';
import type { ResultModel } from '../../../../shared/presentation/result-model';
import { withUnit } from '../../../../shared/presentation/units';
import { Row } from './ReportRow';

/** 1 Result: the statement, its figures, the basis of U and its notes. */
export function ReportResult({ model: m }: { model: ResultModel }) {
  const f = m.reported;
  const u = (x: Figure) => withUnit(x, m.measurand.unit).text;
  return (
    <section aria-labelledby="rep-result" className="break-inside-avoid">
      <h2 id="rep-result" className="mb-1 text-base font-semibold">
        1 Result
      </h2>
      <div className="rounded-md border-l-4 border-accent-600 bg-stone-50 px-3 py-2">
        <p className="text-sm leading-relaxed" data-testid="report-statement">
          {m.statement.text}
        </p>
        <dl
          className="num mt-2 grid grid-cols-[auto_1fr_auto_1fr] gap-x-3 gap-y-0.5 border-t border-stone-300 pt-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr_auto_1fr] [&_dd]:whitespace-nowrap"
          data-testid="report-figures"
        >
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
      {f.secondOrder ? (
        <p className="mt-1 text-xs text-stone-700">With the second-order terms of the Taylor series (GUM 5.1.2, note) the combined standard uncertainty is {u(f.secondOrder)}.</p>
      ) : null}
    </section>
  );
}

/** 2 Measurement model: the equations, the values of intermediate quantities and the constants. */
export function ReportModel({ model: m }: { model: ResultModel }) {
  return (
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
  );
}
