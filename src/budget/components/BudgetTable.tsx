import { Fragment, type ReactNode } from 'react';
import { symbolParts } from '../../../shared/format/symbols';
import type { Figure } from '../../../shared/presentation/figures';
import type { ResultModel } from '../../../shared/presentation/result-model';
import { Num, Sym } from '../../app/ui/quantity';

/*
 * The budget as a chain read left to right, as a metrologist works it by hand:
 * the value as stated, ÷ the divisor = the standard uncertainty, × the
 * sensitivity = the contribution, and its share of the variance. Each input
 * takes two lines, its name and source above its chain; a warning that names
 * the input sits under it. Every figure comes from the shared result model.
 */

function Fig({ f, unit, strong }: { f: Figure; unit?: string; strong?: boolean }) {
  return (
    <span className="whitespace-nowrap">
      <Num text={f.text} value={f.value} className={strong ? 'font-semibold text-stone-900' : ''} />
      {unit ? <span className="ml-1 text-xs text-stone-600">{unit}</span> : null}
    </span>
  );
}

const op = 'pr-1 text-right text-stone-400 select-none';

export function BudgetTable({
  model,
  selected,
  onSelect,
  adornment,
}: {
  model: ResultModel;
  selected?: string;
  onSelect(symbol: string): void;
  /** Rendered after the symbol (e.g. a comment badge); it must not bubble clicks and keys to the row. */
  adornment?(symbol: string): ReactNode;
}) {
  const b = model.budget;
  const yUnit = model.measurand.unit.text;
  const th = 'px-2 pb-1 pt-1.5 text-xs font-semibold text-stone-700 whitespace-nowrap';
  return (
    <div className="overflow-x-auto rounded-md border border-stone-200 bg-white" data-testid="budget-table">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">
          Uncertainty budget: for each input quantity the value as stated, the divisor, the standard uncertainty, the sensitivity coefficient, the contribution and its share of the variance. Select an
          input to see how its contribution was obtained.
        </caption>
        <thead className="border-b border-stone-300 bg-stone-50">
          <tr>
            <th scope="col" className={`${th} text-left`}>
              As stated
            </th>
            <th scope="col" className={`${th} text-right`}>
              <span aria-hidden className="text-stone-400">
                ÷{' '}
              </span>
              divisor
            </th>
            <th scope="col" className={`${th} text-right`}>
              <span aria-hidden className="text-stone-400">
                ={' '}
              </span>
              u(xᵢ)
            </th>
            <th scope="col" className={`${th} text-right`}>
              <span aria-hidden className="text-stone-400">
                ×{' '}
              </span>
              cᵢ
            </th>
            <th scope="col" className={`${th} text-right`}>
              <span aria-hidden className="text-stone-400">
                ={' '}
              </span>
              |cᵢ|·u(xᵢ){yUnit ? <span className="font-normal"> / {yUnit}</span> : null}
            </th>
            <th scope="col" className={`${th} text-right`}>
              share
            </th>
            <th scope="col" className={`${th} text-right`}>
              νᵢ
            </th>
          </tr>
        </thead>
        {b.rows.map((r) => {
          const isSel = selected === r.symbol;
          const select = () => onSelect(r.symbol);
          return (
            <tbody
              key={r.symbol}
              tabIndex={0}
              aria-label={`${r.symbol}: contribution ${r.contribution.text}${yUnit ? ` ${yUnit}` : ''}, ${r.share.text} of the variance`}
              aria-current={isSel ? 'true' : undefined}
              onClick={select}
              onKeyDown={(e) => {
                if (e.key === 'Enter' || e.key === ' ') {
                  e.preventDefault();
                  select();
                }
              }}
              className={`cursor-pointer border-b border-stone-100 last:border-0 focus:outline-none focus-visible:ring-2 focus-visible:ring-accent-600 ${isSel ? 'bg-accent-50' : 'hover:bg-stone-50'}`}
            >
              <tr>
                <th scope="row" colSpan={7} className="px-2 pt-1.5 text-left font-normal">
                  <span data-testid="budget-symbol">
                    <Sym s={r.symbol} className="font-semibold text-stone-900" />
                  </span>
                  {adornment ? adornment(r.symbol) : null}
                  <span className="ml-2 text-xs text-stone-600">
                    {r.description ? `${r.description} · ` : ''}
                    {r.kind} · x = <span className="num">{r.estimate.text}</span>
                    {r.unit.text ? ` ${r.unit.text}` : ''}
                  </span>
                </th>
              </tr>
              <tr className="align-baseline">
                <td className="num px-2 pb-1.5 text-left text-xs text-stone-700">{r.stated.text}</td>
                <td className="px-2 pb-1.5 text-right">
                  <span aria-hidden className={op}>
                    ÷
                  </span>
                  <Fig f={r.divisor} />
                </td>
                <td className="px-2 pb-1.5 text-right">
                  <span aria-hidden className={op}>
                    =
                  </span>
                  <Fig f={r.standardUncertainty} unit={r.unit.text} />
                </td>
                <td className="px-2 pb-1.5 text-right" title={r.sensitivityMethod === 'symbolic' ? 'symbolic derivative' : 'numerical derivative'}>
                  <span aria-hidden className={op}>
                    ×
                  </span>
                  <Fig f={r.sensitivity.figure} unit={r.sensitivity.unit.text} />
                </td>
                <td className="px-2 pb-1.5 text-right">
                  <span aria-hidden className={op}>
                    =
                  </span>
                  <Fig f={r.contribution} strong />
                </td>
                <td className="px-2 pb-1.5 text-right">
                  <Fig f={r.share} />
                </td>
                <td className="px-2 pb-1.5 text-right">
                  <Fig f={r.dof} />
                </td>
              </tr>
              {r.warnings.map((w, i) => (
                <tr key={i}>
                  <td colSpan={7} className="px-2 pb-1.5">
                    <p role="note" className="rounded border-l-2 border-caution-500 bg-caution-50 px-2 py-0.5 text-xs text-caution-700">
                      ⚠ {w.message}
                    </p>
                  </td>
                </tr>
              ))}
            </tbody>
          );
        })}
        {/* a body, not a footer: printed, a footer would repeat the totals under every page's rows */}
        <tbody className="border-t-2 border-stone-300 bg-stone-50 text-sm">
          {(
            [
              [
                <>
                  combined standard uncertainty u<sub>c</sub> = √Σ (cᵢu(xᵢ))²
                </>,
                b.totals.standardUncertainty,
                yUnit,
              ],
              [
                <>
                  effective degrees of freedom ν<sub>eff</sub>
                </>,
                b.totals.effectiveDof,
                '',
              ],
              [<>coverage factor k for p = {b.totals.coverageProbability.text}</>, b.totals.coverageFactor, ''],
              [
                <>
                  expanded uncertainty U = k·u<sub>c</sub>
                </>,
                b.totals.expandedUncertainty,
                yUnit,
              ],
            ] as [ReactNode, Figure, string][]
          ).map(([label, f, unit], i) => (
            <tr key={i}>
              <th scope="row" colSpan={4} className="px-2 py-0.5 text-right text-xs font-normal text-stone-700">
                {label}
              </th>
              <td className="px-2 py-0.5 text-right">
                <Fig f={f} unit={unit} strong />
              </td>
              <td colSpan={2} />
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** A symbol in an SVG label, its subscript lowered and shortened to fit. */
function SymbolLabel({ symbol, maxChars }: { symbol: string; maxChars: number }) {
  const { base, sub } = symbolParts(symbol);
  if (sub === null) return <tspan>{base.length > maxChars ? `${base.slice(0, maxChars - 1)}…` : base}</tspan>;
  const room = Math.max(2, maxChars - base.length);
  return (
    <>
      <tspan>{base}</tspan>
      <tspan fontSize="7" dy="2">
        {sub.length > room ? `${sub.slice(0, room - 1)}…` : sub}
      </tspan>
    </>
  );
}

/**
 * The contributions ranked, largest first: a column per input for its share of the variance,
 * the running total as a line, the dominant term named in words. The table is its text alternative.
 */
export function ContributionsChart({ model, selected, onSelect }: { model: ResultModel; selected?: string; onSelect(symbol: string): void }) {
  const terms = model.budget.ranked;
  const W = 300;
  const H = 170;
  const pad = { l: 30, r: 8, t: 10, b: 46 };
  const slot = (W - pad.l - pad.r) / Math.max(1, terms.length);
  const barW = Math.min(28, slot * 0.64);
  const Y = (f: number) => H - pad.b - f * (H - pad.t - pad.b);
  const X = (i: number) => pad.l + slot * (i + 0.5);
  // a monospace character of the 9-unit labels is about 5.4 units wide
  const maxChars = Math.max(3, Math.floor((slot - 2) / 5.4));
  return (
    <figure className="w-full max-w-lg rounded-md border border-stone-200 bg-white p-3" data-testid="contributions-chart">
      <figcaption className="mb-1 text-sm font-medium text-stone-900">{model.budget.dominant.text}</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="group" aria-label={`Shares of the variance, largest first: ${terms.map((t) => `${t.symbol} ${t.share.text}`).join(', ')}`}>
        {[0, 0.5, 1].map((f) => (
          <g key={f}>
            <line x1={pad.l} x2={W - pad.r} y1={Y(f)} y2={Y(f)} stroke={f === 0 ? '#78716c' : '#e7e5e4'} strokeWidth={f === 0 ? 1 : 0.6} />
            <text x={pad.l - 4} y={Y(f) + 3} fontSize="9" textAnchor="end" fill="#57534e" fontFamily="JetBrains Mono, monospace">
              {f === 0 ? '0 %' : f === 0.5 ? '50 %' : '100 %'}
            </text>
          </g>
        ))}
        {terms.map((t, i) => {
          const v = t.share.value ?? 0;
          const sel = selected === t.symbol;
          return (
            <g
              key={t.symbol}
              role="button"
              tabIndex={0}
              aria-label={`${t.symbol}: ${t.share.text} of the variance, ${t.cumulative.text} with the larger terms`}
              onClick={() => onSelect(t.symbol)}
              onKeyDown={(e) => {
                if (e.key === 'Enter' || e.key === ' ') {
                  e.preventDefault();
                  onSelect(t.symbol);
                }
              }}
              className="cursor-pointer focus:outline-none"
            >
              <rect x={X(i) - slot / 2} y={pad.t} width={slot} height={H - pad.t - pad.b + 40} fill={sel ? '#eef4f8' : 'transparent'} />
              <rect x={X(i) - barW / 2} y={Y(v)} width={barW} height={Math.max(0.8, H - pad.b - Y(v))} fill={i === 0 ? '#1f5a85' : '#b9cada'} />
            </g>
          );
        })}
        {/* The column's labels lie outside its button, whose name says them in full (a truncated symbol would not match it); clicks fall through to the column. */}
        {terms.map((t, i) => (
          <g key={t.symbol} aria-hidden pointerEvents="none">
            <text x={X(i)} y={H - pad.b + 12} fontSize="9" textAnchor="middle" fill="#1c1917" fontFamily="JetBrains Mono, monospace">
              <SymbolLabel symbol={t.symbol} maxChars={maxChars} />
            </text>
            <text x={X(i)} y={H - pad.b + 23} fontSize="9" textAnchor="middle" fill="#44403c" fontFamily="JetBrains Mono, monospace">
              {t.share.text}
            </text>
          </g>
        ))}
        {terms.length > 1 ? <polyline fill="none" stroke="#1f5a85" strokeWidth="1.2" points={terms.map((t, i) => `${X(i)},${Y(t.cumulative.value ?? 0)}`).join(' ')} /> : null}
        {terms.map((t, i) => (
          <circle key={t.symbol} cx={X(i)} cy={Y(t.cumulative.value ?? 0)} r="2" fill="#1f5a85" />
        ))}
        <text x={W - pad.r} y={H - 4} fontSize="8.5" textAnchor="end" fill="#57534e">
          columns: share of u_c² · line: running total
        </text>
      </svg>
    </figure>
  );
}

/** The budget and its ranked contributions together, as the report shows them. */
export function BudgetWithContributions({ model }: { model: ResultModel }) {
  return (
    <Fragment>
      <BudgetTable model={model} onSelect={() => {}} />
      <ContributionsChart model={model} onSelect={() => {}} />
    </Fragment>
  );
}
