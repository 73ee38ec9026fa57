import type { BudgetResult } from '../../../../shared/budget/result';
import { resultStatement } from '../../../../shared/gum/statement';
import { roundUncertainty } from '../../../../shared/gum/rounding';
import { formatAt, formatDof, formatSignificant, fullPrecision } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import { formatUnit } from '../../../app/ui/units';
import type { UMove } from '../live';

type Item = 'y' | 'uc' | 'nu' | 'k' | 'U';

function prettyStatement(s: string): string {
  return s
    .replace(/-(?=\d)/g, '\u2212')
    .replace(/\(([^()]*?) ± ([^()]*?)\)/, (_m, a: string, b: string) => `(${a} ± ${b})`);
}

export function ResultCard({
  result,
  stale,
  move,
  selected,
  onSelect,
  problemsCount,
}: {
  result: BudgetResult | null;
  stale: boolean;
  move: UMove | null;
  selected?: Item;
  onSelect(item: Item): void;
  problemsCount: number;
}) {
  if (!result) {
    return (
      <section aria-label="Result" className="rounded-lg border border-caution-500 bg-white p-4">
        <h2 className="text-sm font-semibold text-stone-800">Result</h2>
        <p className="mt-2 text-sm text-caution-700">
          ⚠ {problemsCount === 1 ? 'One problem stops' : `${problemsCount} problems stop`} the computation. Each is shown beside its field.
        </p>
      </section>
    );
  }
  const g = result.gum;
  const unit = result.measurand.unit;
  const u = formatUnit(unit);
  const r = roundUncertainty(g.expandedUncertainty);
  const ru = roundUncertainty(g.standardUncertainty);
  const items: { key: Item; label: React.ReactNode; text: string; value: number | null; unit?: string }[] = [
    { key: 'y', label: <Sym s={result.measurand.symbol} />, text: formatAt(g.estimate, Math.min(r.exponent, ru.exponent)), value: g.estimate, unit: u },
    { key: 'uc', label: <>u<sub>c</sub></>, text: formatAt(g.standardUncertainty, ru.exponent), value: g.standardUncertainty, unit: u },
    { key: 'nu', label: <>ν<sub>eff</sub></>, text: formatDof(g.effectiveDof), value: g.effectiveDof },
    { key: 'k', label: 'k', text: g.coverageFactor.toFixed(2), value: g.coverageFactor },
    { key: 'U', label: 'U', text: formatAt(g.expandedUncertainty, r.exponent), value: g.expandedUncertainty, unit: u },
  ];
  const secondOrder = result.warnings.find((w) => w.startsWith('Second-order'));
  const otherWarnings = result.warnings.filter((w) => w !== secondOrder);
  const delta = move ? move.to - move.from : 0;
  const pct = move && move.from !== 0 ? (delta / move.from) * 100 : null;
  return (
    <section aria-label="Result" aria-live="polite" className={`rounded-lg border border-stone-300 bg-white p-4 shadow-sm transition-opacity ${stale ? 'opacity-70' : ''}`}>
      <div className="flex items-baseline justify-between">
        <h2 className="text-sm font-semibold text-stone-800">Result (GUM)</h2>
        <span className="text-xs text-stone-600">p = {+(g.coverageProbability * 100).toFixed(2)} %</span>
      </div>
      <dl className="mt-2 grid grid-cols-1 gap-0.5">
        {items.map((it) => (
          <div key={it.key}>
            <button
              type="button"
              onClick={() => onSelect(it.key)}
              aria-pressed={selected === it.key}
              className={`grid w-full grid-cols-[3.5rem_1fr] items-baseline gap-2 rounded px-2 py-0.5 text-left ${selected === it.key ? 'bg-accent-50 ring-1 ring-accent-600' : 'hover:bg-stone-50'}`}
              title={it.value !== null ? `unrounded: ${fullPrecision(it.value)} — select to see how it was obtained` : 'select to see how it was obtained'}
            >
              <dt className="text-sm text-stone-700">{it.label}</dt>
              <dd className={`num text-right ${it.key === 'y' || it.key === 'U' ? 'text-lg font-semibold text-stone-900' : 'text-sm text-stone-800'}`}>
                {it.text}
                {it.unit ? <span className="ml-1 text-sm font-normal text-stone-600">{it.unit}</span> : null}
              </dd>
            </button>
          </div>
        ))}
      </dl>
      {move && delta !== 0 ? (
        <p className="mt-2 text-xs text-stone-700">
          Your last edit {delta > 0 ? 'raised' : 'lowered'} U by <span className="num">{formatSignificant(Math.abs(delta), 2)}</span> {u}
          {pct !== null ? <> ({delta > 0 ? '+' : '−'}{Math.abs(pct).toFixed(Math.abs(pct) < 1 ? 2 : 1)} %)</> : null}.
        </p>
      ) : null}
      <div className="mt-3 rounded-md bg-stone-50 p-2">
        <p className="text-xs font-medium text-stone-700">Statement for the certificate</p>
        <p className="mt-1 text-sm leading-snug text-stone-900">{prettyStatement(resultStatement({ symbol: result.measurand.symbol, unit: u || undefined }, result))}</p>
      </div>
      {secondOrder ? (
        <p role="note" className="mt-2 rounded-md border border-caution-500 bg-caution-50 px-2 py-1 text-xs text-caution-700">
          ⚠ {secondOrder}
        </p>
      ) : null}
      {otherWarnings.map((w, i) => (
        <p key={i} role="note" className="mt-2 rounded-md border border-caution-100 bg-caution-50 px-2 py-1 text-xs text-caution-700">
          ⚠ {w}
        </p>
      ))}
    </section>
  );
}
