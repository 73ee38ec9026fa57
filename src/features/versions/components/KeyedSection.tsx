import type { KeyedDiff } from '../../../../shared/api/diff';
import { Sym } from '../../../app/ui/quantity';
import { ChangeRows, FieldTable, Section, show, Tag } from './CompareParts';

/** Added, removed and changed inputs, constants or correlations, each with its fields. */
export function KeyedSection({ id, title, diff, noun }: { id: string; title: string; diff: KeyedDiff; noun: string }) {
  const total = diff.added.length + diff.removed.length + diff.changed.length;
  const name = (o: Record<string, unknown>) => (typeof o.symbol === 'string' ? o.symbol : Array.isArray(o.between) ? (o.between as string[]).join(' ↔ ') : JSON.stringify(o));
  return (
    <Section id={id} title={title} badge={total ? <Tag kind="changed" /> : <Tag kind="same" />}>
      {total === 0 ? (
        <p className="text-sm text-stone-600">No {noun} changed.</p>
      ) : (
        <div className="flex flex-col gap-3">
          {diff.added.map((o) => (
            <div key={`a${name(o)}`} data-testid={`${id}-added-${name(o)}`} className="rounded-md border-l-4 border-accent-600 bg-accent-50/60 px-3 py-2 text-sm">
              <div className="flex items-center gap-2">
                <Sym s={name(o)} className="font-semibold" /> <Tag kind="added" />
              </div>
              <p className="num mt-1 break-all text-xs text-stone-700">{show(o.distribution ?? (o.value !== undefined ? { value: o.value, unit: o.unit } : o.r !== undefined ? { r: o.r } : o))}</p>
            </div>
          ))}
          {diff.removed.map((o) => (
            <div key={`r${name(o)}`} data-testid={`${id}-removed-${name(o)}`} className="rounded-md border-l-4 border-caution-500 bg-caution-50/60 px-3 py-2 text-sm">
              <div className="flex items-center gap-2">
                <Sym s={name(o)} className="font-semibold line-through" /> <Tag kind="removed" />
              </div>
              <p className="num mt-1 break-all text-xs text-stone-700">{show(o.distribution ?? (o.value !== undefined ? { value: o.value, unit: o.unit } : o.r !== undefined ? { r: o.r } : o))}</p>
            </div>
          ))}
          {diff.changed.map((c) => (
            <div key={c.key} data-testid={`${id}-changed-${c.key}`} className="rounded-md border-l-4 border-caution-500 px-3 py-2">
              <div className="mb-1 flex items-center gap-2 text-sm">
                <Sym s={c.key.includes('|') ? c.key.replace('|', ' ↔ ') : c.key} className="font-semibold" /> <Tag kind="changed" />
                <span className="text-xs text-stone-600">
                  {c.changes.length} field{c.changes.length === 1 ? '' : 's'}
                </span>
              </div>
              <FieldTable caption={`Changed fields of ${c.key}`}>
                <ChangeRows changes={c.changes} />
              </FieldTable>
            </div>
          ))}
        </div>
      )}
    </Section>
  );
}
