import type { ResultModel } from '../../../../shared/presentation/result-model';
import type { ReportFacts } from '../report-facts';

/** The caution and the signature lines of the author and the reviewer. */
export function ReportSignatures({ model: m, facts }: { model: ResultModel; facts: ReportFacts }) {
  return (
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
  );
}

/** The appendix: the readings of each input evaluated from observations and the correlation matrix; nothing when there are neither. */
export function ReportAppendix({ model: m }: { model: ResultModel }) {
  if (!m.observations.length && !m.correlations) return null;
  return (
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
  );
}
