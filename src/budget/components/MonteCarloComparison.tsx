import type { MonteCarloView } from '../../../shared/presentation/result-model';
import type { VerdictView } from '../../../shared/presentation/verdict';

/**
 * GUM and Monte Carlo figures side by side at one decimal place, with the
 * stability of an adaptive run, from the result model: the Monte Carlo panel
 * and the report show the same table. `heading` names the Monte Carlo column
 * where nothing above the table says how many trials were run.
 */
export function MonteCarloComparison({ view, unit, heading = 'Monte Carlo', dense = false }: { view: MonteCarloView; unit: string; heading?: string; dense?: boolean }) {
  const cell = dense ? 'py-0.5' : 'py-1';
  return (
    <table className="w-full text-sm" data-testid="mc-comparison">
      <caption className="sr-only">GUM and Monte Carlo results side by side</caption>
      <thead className="text-xs text-stone-700">
        <tr className="border-b border-stone-300">
          <th className={`${cell} text-left font-normal text-stone-600`}>{unit ? `values in ${unit}` : 'dimensionless values'}</th>
          <th className={`${cell} text-right font-semibold`}>GUM</th>
          <th className={`${cell} text-right font-semibold`}>{heading}</th>
        </tr>
      </thead>
      <tbody className="num">
        {view.rows.map((r) => (
          <tr key={r.label} className="border-b border-stone-100 last:border-0">
            <th scope="row" className={`${cell} text-left font-sans font-normal text-stone-700`}>
              {r.label}
            </th>
            <td className={`${cell} text-right ${r.gum ? '' : 'text-stone-500'}`}>{r.gum ? r.gum.text : '—'}</td>
            <td className={`${cell} text-right`}>{r.monteCarlo.text}</td>
          </tr>
        ))}
      </tbody>
      {view.stability ? (
        <tfoot>
          <tr>
            <td colSpan={3} className="pt-1 text-xs text-stone-600">
              {view.stability}
            </td>
          </tr>
        </tfoot>
      ) : null}
    </table>
  );
}

/** The clause 8 comparison in words (JCGM 101:2008 8), from the result model. */
export function ValidationVerdict({ view }: { view: VerdictView | null }) {
  if (!view) return null;
  const tone =
    view.tone === 'good'
      ? 'border-accent-600 bg-accent-50 text-accent-700'
      : view.tone === 'warning'
        ? 'border-caution-500 bg-caution-50 text-caution-700'
        : 'border-stone-300 bg-white text-stone-800';
  return (
    <p className={`rounded-md border px-3 py-2 text-sm ${tone}`} data-testid="mc-verdict">
      <span className="font-semibold">
        {view.tone === 'good' ? '✓ ' : view.tone === 'warning' ? '⚠ ' : ''}
        {view.headline}
      </span>{' '}
      {view.detail.text}
    </p>
  );
}
