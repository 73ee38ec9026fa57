import type { ReactNode } from 'react';
import type { Delta, FieldChange } from '../../../../shared/api/diff';
import { fieldName } from '../../../../shared/presentation/field-names';
import { formatSignificant } from '../../../app/ui/numbers';

/** Added, removed, changed: each its own colour, mark and word. */
const MARK = {
  added: { mark: '+', word: 'added', cls: 'border-accent-600 bg-accent-50 text-accent-700' },
  removed: { mark: '−', word: 'removed', cls: 'border-caution-500 bg-caution-50 text-caution-700' },
  changed: { mark: '≠', word: 'changed', cls: 'border-caution-500 bg-caution-50 text-caution-700' },
  same: { mark: '=', word: 'unchanged', cls: 'border-stone-300 bg-white text-stone-600' },
} as const;
export type Kind = keyof typeof MARK;

export function Tag({ kind }: { kind: Kind }) {
  const m = MARK[kind];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-1.5 text-[11px] font-semibold ${m.cls}`}>
      <span aria-hidden>{m.mark}</span>
      {m.word}
    </span>
  );
}

/** A field value as the comparison shows it: numbers to six significant digits, long series shortened. */
export function show(v: unknown): string {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'number') return formatSignificant(v, 6);
  if (typeof v === 'string') return v === '' ? '“”' : v;
  if (Array.isArray(v) && v.length > 6 && v.every((x) => typeof x === 'number'))
    return `${v.length} values: ${v
      .slice(0, 4)
      .map((x) => formatSignificant(x as number, 4))
      .join(', ')}, …`;
  if (typeof v === 'object' && !Array.isArray(v))
    return Object.entries(v as Record<string, unknown>)
      .map(([k, x]) => `${fieldName(k)} ${show(x)}`)
      .join(', ');
  return JSON.stringify(v);
}

export function Section({ id, title, children, badge }: { id: string; title: string; children: ReactNode; badge?: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-h`} className="rounded-lg border border-stone-200 bg-white p-4">
      <div className="mb-2 flex items-center gap-2">
        <h2 id={`${id}-h`} className="text-base font-semibold text-stone-900">
          {title}
        </h2>
        {badge}
      </div>
      {children}
    </section>
  );
}

export function ChangeRows({ changes, label }: { changes: FieldChange[]; label?: string }) {
  return (
    <>
      {changes.map((c) => (
        <tr key={c.field} className="border-b border-stone-100 last:border-0" data-change="changed">
          <td className="px-2 py-1 text-xs text-stone-700">
            {label ? `${label} ` : ''}
            <span title={c.field}>{fieldName(c.field)}</span>
          </td>
          <td className="num px-2 py-1 text-stone-700 line-through decoration-caution-500/60">{show(c.from)}</td>
          <td className="num bg-caution-50/60 px-2 py-1 font-semibold text-stone-900">{show(c.to)}</td>
          <td className="px-2 py-1">
            <Tag kind="changed" />
          </td>
        </tr>
      ))}
    </>
  );
}

export function FieldTable({ children, caption }: { children: ReactNode; caption: string }) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead className="border-b border-stone-200 text-xs text-stone-700">
        <tr>
          <th scope="col" className="px-2 py-1 font-semibold">
            Field
          </th>
          <th scope="col" className="px-2 py-1 font-semibold">
            Before
          </th>
          <th scope="col" className="px-2 py-1 font-semibold">
            After
          </th>
          <th scope="col" className="px-2 py-1 font-semibold">
            <span className="sr-only">Change</span>
          </th>
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}

export function deltaKind(d: Delta): Kind {
  if (d.from === null && d.to !== null) return 'added';
  if (d.from !== null && d.to === null) return 'removed';
  return d.delta === 0 || d.delta === null ? 'same' : 'changed';
}
