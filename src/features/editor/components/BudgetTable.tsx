import type { ReactNode } from 'react';
import type { BudgetResult } from '../../../../shared/budget/result';
import type { InputQuantity } from '../../../../shared/budget/schema';
import { formatDof, formatPercent, formatSignificant, formatUncertainty, formatWithUncertainty, fullPrecision, splitDecimal } from '../../../app/ui/numbers';
import { Sym, Unit } from '../../../app/ui/quantity';
import { formatUnit, ratioUnit } from '../../../app/ui/units';
import { KIND_SHORT } from './kinds';

/** A column of numbers aligned on the decimal sign. */
function alignColumn(texts: string[]): { int: number; frac: number } {
  let int = 0;
  let frac = 0;
  for (const t of texts) {
    const [a, b] = splitDecimal(t);
    int = Math.max(int, [...a].length);
    frac = Math.max(frac, [...b].length);
  }
  return { int, frac };
}

function Aligned({ text, w, value }: { text: string; w: { int: number; frac: number }; value?: number | null }) {
  const [a, b] = splitDecimal(text);
  return (
    <span className="num inline-flex whitespace-pre" title={value !== undefined ? `unrounded: ${fullPrecision(value)}` : undefined}>
      <span className="inline-block text-right" style={{ minWidth: `${w.int}ch` }}>
        {a}
      </span>
      <span className="inline-block text-left" style={{ minWidth: `${w.frac}ch` }}>
        {b}
      </span>
    </span>
  );
}

export function BudgetTable({
  result,
  inputs,
  selected,
  onSelect,
  adornment,
}: {
  result: BudgetResult;
  inputs: InputQuantity[];
  selected?: string;
  onSelect(symbol: string): void;
  /** Rendered after the symbol (e.g. a comment badge); it must not bubble clicks and keys to the row. */
  adornment?(symbol: string): ReactNode;
}) {
  const rows = result.gum.contributions;
  const yUnit = result.measurand.unit;
  const cols = {
    x: rows.map((c) => formatWithUncertainty(c.estimate, c.standardUncertainty)),
    u: rows.map((c) => (c.standardUncertainty > 0 ? formatUncertainty(c.standardUncertainty) : '0')),
    c: rows.map((c) => formatSignificant(c.sensitivity, 3)),
    cu: rows.map((c) => (c.contribution > 0 ? formatUncertainty(c.contribution) : '0')),
    nu: rows.map((c) => formatDof(c.dof)),
  };
  const w = { x: alignColumn(cols.x), u: alignColumn(cols.u), c: alignColumn(cols.c), cu: alignColumn(cols.cu), nu: alignColumn(cols.nu) };
  const th = 'px-2 py-1.5 font-semibold whitespace-nowrap';
  return (
    <div className="overflow-x-auto rounded-md border border-stone-200 bg-white">
      <table className="w-full text-sm">
        <caption className="sr-only">Uncertainty budget: one row per input quantity. Select a row to see how its contribution was obtained.</caption>
        <thead className="border-b border-stone-200 bg-stone-50 text-xs text-stone-700">
          <tr>
            <th scope="col" className={`${th} text-left`}>Quantity Xᵢ</th>
            <th scope="col" className={`${th} text-right`}>Estimate xᵢ</th>
            <th scope="col" className={`${th} text-left`}>Unit</th>
            <th scope="col" className={`${th} text-left`}>Distribution</th>
            <th scope="col" className={`${th} text-right`}>u(xᵢ)</th>
            <th scope="col" className={`${th} text-right`}>cᵢ</th>
            <th scope="col" className={`${th} text-left`}>
              <span className="sr-only">Unit of cᵢ</span>
            </th>
            <th scope="col" className={`${th} text-right`}>
              |cᵢ|·u(xᵢ){formatUnit(yUnit) ? <span className="font-normal"> / {formatUnit(yUnit)}</span> : null}
            </th>
            <th scope="col" className={`${th} text-right`}>Share</th>
            <th scope="col" className={`${th} text-right`}>νᵢ</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((c, i) => {
            const q = inputs.find((x) => x.symbol === c.symbol);
            const isSel = selected === c.symbol;
            return (
              <tr
                key={c.symbol}
                tabIndex={0}
                aria-selected={isSel}
                onClick={() => onSelect(c.symbol)}
                onKeyDown={(e) => {
                  if (e.key === 'Enter' || e.key === ' ') {
                    e.preventDefault();
                    onSelect(c.symbol);
                  }
                }}
                className={`cursor-pointer border-b border-stone-100 last:border-0 ${isSel ? 'bg-accent-50' : 'hover:bg-stone-50'}`}
              >
                <th scope="row" className="whitespace-nowrap px-2 py-1 text-left font-semibold">
                  <Sym s={c.symbol} />
                  {adornment ? adornment(c.symbol) : null}
                </th>
                <td className="px-2 py-1 text-right">
                  <Aligned text={cols.x[i]} w={w.x} value={c.estimate} />
                </td>
                <td className="px-2 py-1 text-left">
                  <Unit u={c.unit} />
                </td>
                <td className="px-2 py-1 text-left text-xs text-stone-700">{q ? (q.distribution.kind === 'observations' ? `Type A, n = ${q.distribution.values.length}` : KIND_SHORT[q.distribution.kind]) : c.kind}</td>
                <td className="px-2 py-1 text-right">
                  <Aligned text={cols.u[i]} w={w.u} value={c.standardUncertainty} />
                </td>
                <td className="px-2 py-1 text-right">
                  <Aligned text={cols.c[i]} w={w.c} value={c.sensitivity} />
                </td>
                <td className="whitespace-nowrap px-1 py-1 text-left text-xs text-stone-600">{ratioUnit(yUnit, c.unit)}</td>
                <td className="px-2 py-1 text-right">
                  <Aligned text={cols.cu[i]} w={w.cu} value={c.contribution} />
                </td>
                <td className="num px-2 py-1 text-right">{formatPercent(c.varianceShare)}</td>
                <td className="px-2 py-1 text-right">
                  <Aligned text={cols.nu[i]} w={w.nu} value={c.dof} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** Shares of the variance, largest first; the table beside it is its text alternative. */
export function SharesChart({ result, selected, onSelect }: { result: BudgetResult; selected?: string; onSelect(symbol: string): void }) {
  const rows = [...result.gum.contributions].sort((a, b) => b.varianceShare - a.varianceShare);
  const max = Math.max(...rows.map((r) => r.varianceShare), 1e-12);
  return (
    <figure className="rounded-md border border-stone-200 bg-white p-3">
      <figcaption className="mb-2 text-xs font-medium text-stone-700">Share of the variance u_c², largest first</figcaption>
      <ul className="flex flex-col gap-1">
        {rows.map((r) => (
          <li key={r.symbol}>
            <button
              type="button"
              onClick={() => onSelect(r.symbol)}
              className={`grid w-full grid-cols-[6rem_1fr_4.5rem] items-center gap-2 rounded px-1 text-left text-sm ${selected === r.symbol ? 'bg-accent-50' : 'hover:bg-stone-50'}`}
              aria-label={`${r.symbol}: ${formatPercent(r.varianceShare)} of the variance`}
            >
              <Sym s={r.symbol} className="truncate" />
              <span className="h-3 rounded-sm bg-stone-100">
                <span className="block h-3 rounded-sm bg-accent-600" style={{ width: `${(r.varianceShare / max) * 100}%` }} />
              </span>
              <span className="num text-right text-xs">{formatPercent(r.varianceShare)}</span>
            </button>
          </li>
        ))}
      </ul>
    </figure>
  );
}
