import type { BudgetDiff } from '../../../../shared/api/diff';
import { lineDiff, type LineChange } from '../../../../shared/presentation/line-diff';

function Cell({ text, change, side }: { text: string | null; change: LineChange; side: 'left' | 'right' }) {
  const hit = change !== 'same' && text !== null;
  const tone = !hit ? '' : side === 'left' ? 'bg-caution-50 text-caution-700' : change === 'added' ? 'bg-accent-50 text-accent-700' : 'bg-caution-50 text-stone-900';
  const mark = !hit ? ' ' : side === 'left' ? '−' : change === 'added' ? '+' : '≠';
  return (
    <td className={`num whitespace-pre-wrap break-all px-2 py-0.5 align-top text-[13px] ${tone}`}>
      <span aria-hidden className="mr-2 select-none text-stone-500">
        {mark}
      </span>
      {hit ? <span className="sr-only">{side === 'left' ? 'removed: ' : change === 'added' ? 'added: ' : 'changed to: '}</span> : null}
      {text ?? ''}
    </td>
  );
}

/** The model lines of both versions side by side (`lineDiff`). */
export function ModelDiff({ d }: { d: BudgetDiff }) {
  const rows = lineDiff(d.model.from, d.model.to);
  return (
    <table className="w-full table-fixed border-collapse rounded-md border border-stone-200">
      <caption className="sr-only">
        Model lines, version {d.from} on the left and version {d.to} on the right
      </caption>
      <thead className="text-xs text-stone-700">
        <tr className="border-b border-stone-200">
          <th scope="col" className="px-2 py-1 text-left font-semibold">
            v{d.from}
          </th>
          <th scope="col" className="border-l border-stone-200 px-2 py-1 text-left font-semibold">
            v{d.to}
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i} data-change={r.change} className="border-b border-stone-100 last:border-0">
            <Cell text={r.left} change={r.change} side="left" />
            <Cell text={r.right} change={r.change} side="right" />
          </tr>
        ))}
      </tbody>
    </table>
  );
}
