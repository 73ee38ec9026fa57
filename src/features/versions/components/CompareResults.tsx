import type { BudgetDiff } from '../../../../shared/api/diff';
import { compareContributions, compareResults, type ComparedFigure } from '../../../../shared/presentation/compare';
import type { Figure } from '../../../../shared/presentation/figures';
import { fullPrecision } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import { deltaKind, Tag } from './CompareParts';

function Change({ c }: { c: ComparedFigure }) {
  const d = c.delta;
  if (d.delta === null || d.delta === 0 || !c.change) return <span className="text-xs text-stone-500">{d.delta === 0 ? '= unchanged' : '—'}</span>;
  const up = d.delta > 0;
  return (
    <span className={`num whitespace-nowrap font-semibold ${up ? 'text-caution-700' : 'text-accent-700'}`} title={`unrounded: ${fullPrecision(d.delta)}`}>
      <span aria-hidden>{up ? '▲' : '▼'}</span>
      <span className="sr-only">{up ? 'up by' : 'down by'}</span> {c.change.text}
      {c.relative ? <span className="ml-1 font-normal text-stone-600">({c.relative.text})</span> : null}
    </span>
  );
}

function value(f: Figure | null) {
  if (f === null) return <span className="text-stone-500">—</span>;
  return (
    <span className="num" title={f.value !== null ? `unrounded: ${fullPrecision(f.value)}` : undefined}>
      {f.text}
    </span>
  );
}

/** The result figures of both versions and the change of each. */
export function ResultSection({ d, unit }: { d: BudgetDiff; unit: string }) {
  const rows = compareResults(d.result);
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">The result in both versions</caption>
      <thead className="border-b border-stone-200 text-xs text-stone-700">
        <tr>
          <th scope="col" className="px-2 py-1 text-left font-semibold">
            Quantity
          </th>
          <th scope="col" className="px-2 py-1 text-right font-semibold">
            v{d.from}
          </th>
          <th scope="col" className="px-2 py-1 text-right font-semibold">
            v{d.to}
          </th>
          <th scope="col" className="px-2 py-1 text-left font-semibold">
            Change
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => {
          const k = deltaKind(r.delta);
          return (
            <tr key={r.label} data-change={k} className={`border-b border-stone-100 last:border-0 ${k !== 'same' ? 'bg-caution-50/50' : ''}`}>
              <th scope="row" className="px-2 py-1 text-left font-medium">
                {r.label}
                {r.symbol ? (
                  <>
                    {' '}
                    <Sym s={r.symbol} />
                  </>
                ) : null}
                {r.inUnit && unit ? <span className="font-normal text-stone-600"> / {unit}</span> : null}
              </th>
              <td className="px-2 py-1 text-right">{value(r.from)}</td>
              <td className="px-2 py-1 text-right">{value(r.to)}</td>
              <td className="px-2 py-1">
                <Change c={r} />
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/** Each contribution in both versions, its change and its share. */
export function ContributionsSection({ d, unit }: { d: BudgetDiff; unit: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Each contribution in both versions</caption>
        <thead className="border-b border-stone-200 text-xs text-stone-700">
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-semibold">
              Xᵢ
            </th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">
              u(xᵢ) v{d.from}
            </th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">
              u(xᵢ) v{d.to}
            </th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">
              |cᵢ|·u(xᵢ) v{d.from}
            </th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">
              |cᵢ|·u(xᵢ) v{d.to}
            </th>
            <th scope="col" className="px-2 py-1 text-left font-semibold">
              Change of |cᵢ|·u(xᵢ){unit ? ` / ${unit}` : ''}
            </th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">
              Share v{d.from} → v{d.to}
            </th>
          </tr>
        </thead>
        <tbody>
          {compareContributions(d.result).map((c) => {
            const k = deltaKind(c.contribution.delta);
            return (
              <tr
                key={c.symbol}
                data-testid={`contribution-${c.symbol}`}
                data-change={k}
                className={`border-b border-stone-100 last:border-0 ${k === 'same' ? '' : k === 'added' ? 'bg-accent-50/60' : 'bg-caution-50/50'}`}
              >
                <th scope="row" className="px-2 py-1 text-left">
                  <span className="inline-flex items-center gap-1.5">
                    <Sym s={c.symbol} className="font-semibold" />
                    {k !== 'same' ? <Tag kind={k} /> : null}
                  </span>
                </th>
                <td className="px-2 py-1 text-right">{value(c.standardUncertainty.from)}</td>
                <td className="px-2 py-1 text-right">{value(c.standardUncertainty.to)}</td>
                <td className="px-2 py-1 text-right">{value(c.contribution.from)}</td>
                <td className="px-2 py-1 text-right">{value(c.contribution.to)}</td>
                <td className="px-2 py-1">
                  <Change c={c.contribution} />
                </td>
                <td className="num whitespace-nowrap px-2 py-1 text-right">
                  {c.share.from?.text ?? '—'} → {c.share.to?.text ?? '—'}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
