import { relativeChange, uncertainty, unrounded, type Figure } from '../../../../shared/presentation/figures';
import type { ResultModel } from '../../../../shared/presentation/result-model';
import { Sym } from '../../../app/ui/quantity';
import type { UMove } from '../live';

type Item = 'y' | 'uc' | 'nu' | 'k' | 'U';

export function ResultCard({
  model,
  stale,
  move,
  selected,
  onSelect,
  problemsCount,
}: {
  model: ResultModel | null;
  stale: boolean;
  move: UMove | null;
  selected?: Item;
  onSelect(item: Item): void;
  problemsCount: number;
}) {
  if (!model) {
    return (
      <section aria-label="Result" className="rounded-lg border border-caution-500 bg-white p-4">
        <h2 className="text-sm font-semibold text-stone-800">Result</h2>
        <p className="mt-2 text-sm text-caution-700">⚠ {problemsCount === 1 ? 'One problem stops' : `${problemsCount} problems stop`} the computation. Each is shown beside its field.</p>
      </section>
    );
  }
  const f = model.reported;
  const u = model.measurand.unit.text;
  const items: { key: Item; label: React.ReactNode; figure: Figure; unit?: string }[] = [
    { key: 'y', label: <Sym s={model.measurand.symbol} />, figure: f.estimate, unit: u },
    {
      key: 'uc',
      label: (
        <>
          u<sub>c</sub>
        </>
      ),
      figure: f.standardUncertainty,
      unit: u,
    },
    {
      key: 'nu',
      label: (
        <>
          ν<sub>eff</sub>
        </>
      ),
      figure: f.effectiveDof,
    },
    ...(f.coverageFactor ? [{ key: 'k' as const, label: 'k', figure: f.coverageFactor }] : []),
    { key: 'U', label: 'U', figure: f.expandedUncertainty, unit: u },
  ];
  const secondOrder = model.warnings.find((w) => w.code === 'second-order-significant');
  const otherWarnings = model.warnings.filter((w) => w !== secondOrder);
  const delta = move ? move.to - move.from : 0;
  return (
    <section aria-label="Result" aria-live="polite" className={`rounded-lg border border-stone-300 bg-white p-4 shadow-sm transition-opacity ${stale ? 'opacity-70' : ''}`}>
      <div className="flex items-baseline justify-between">
        <h2 className="text-sm font-semibold text-stone-800">Result</h2>
        <span className="text-xs text-stone-600">
          p = <span className="num">{f.coverageProbability.text}</span>
        </span>
      </div>
      {/* each figure is a button that explains it, so a list of buttons rather than a definition list */}
      <ul className="mt-2 grid grid-cols-1 gap-0.5">
        {items.map((it) => (
          <li key={it.key}>
            <button
              type="button"
              onClick={() => onSelect(it.key)}
              aria-pressed={selected === it.key}
              className={`grid w-full grid-cols-[3.5rem_1fr] items-baseline gap-2 rounded px-2 py-0.5 text-left ${selected === it.key ? 'bg-accent-50 ring-1 ring-accent-600' : 'hover:bg-stone-50'}`}
              title={it.figure.value !== null ? `unrounded: ${unrounded(it.figure.value)} — select to see how it was obtained` : 'select to see how it was obtained'}
            >
              <span className="text-sm text-stone-700">{it.label}</span>
              <span className={`num text-right ${it.key === 'y' || it.key === 'U' ? 'text-lg font-semibold text-stone-900' : 'text-sm text-stone-800'}`}>
                {it.figure.text}
                {it.unit ? <span className="ml-1 text-sm font-normal text-stone-600">{it.unit}</span> : null}
              </span>
            </button>
          </li>
        ))}
      </ul>
      <p className="mt-1 px-2 text-[11px] text-stone-600">U from {f.basisWords}</p>
      {f.notes.map((n) => (
        <p key={n} role="note" className="mt-1 rounded-md border border-caution-500 bg-caution-50 px-2 py-1 text-xs text-caution-700">
          ⚠ {n}
        </p>
      ))}
      {move && delta !== 0 ? (
        <p className="mt-2 text-xs text-stone-700">
          Your last edit {delta > 0 ? 'raised' : 'lowered'} U by <span className="num">{uncertainty(Math.abs(delta)).text}</span> {u}
          {move.from !== 0 ? (
            <>
              {' '}
              (<span className="num">{relativeChange(delta / move.from).text}</span>)
            </>
          ) : null}
          .
        </p>
      ) : null}
      <div className="mt-3 rounded-md bg-stone-50 p-2">
        <p className="text-xs font-medium text-stone-700">Statement for the certificate</p>
        <p className="mt-1 text-sm leading-snug text-stone-900" data-testid="card-statement">
          {model.statement.text}
        </p>
      </div>
      {secondOrder ? (
        <p role="note" className="mt-2 rounded-md border border-caution-500 bg-caution-50 px-2 py-1 text-xs text-caution-700">
          ⚠ {secondOrder.message}
        </p>
      ) : null}
      <p className="mt-2 text-[11px] leading-snug text-stone-500">{model.caution}</p>
      {otherWarnings.map((w, i) => (
        <p key={i} role="note" data-warning={w.code} className="mt-2 rounded-md border border-caution-100 bg-caution-50 px-2 py-1 text-xs text-caution-700">
          ⚠ {w.message}
        </p>
      ))}
    </section>
  );
}
