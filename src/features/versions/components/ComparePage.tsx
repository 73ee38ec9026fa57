import { useQuery } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { BudgetDiff, Delta, FieldChange, KeyedDiff } from '../../../../shared/api/diff';
import { errorMessage } from '../../../app/http';
import { Breadcrumb } from '../../../app/ui/breadcrumb';
import { Button, EmptyState, ErrorNote, Field, Select, Spinner } from '../../../app/ui/controls';
import { compareContributions, compareResults, type ComparedFigure } from '../../../../shared/presentation/compare';
import { fieldName } from '../../../../shared/presentation/field-names';
import type { Figure } from '../../../../shared/presentation/figures';
import { formatDateTime, formatSignificant, fullPrecision } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import { StatusBadge, statusLabel } from '../../../budget/components/StatusBadge';
import { versionStatus } from '../../../../shared/policy/version-status';
import { formatUnit } from '../../../app/ui/units';
import { versionQuery as versionUnitQuery } from '../../../budget/queries';
import { useBudgetHeader, useDiff, useVersions } from '../api/versions';

/** Added, removed, changed: each its own colour, mark and word. */
const MARK = {
  added: { mark: '+', word: 'added', cls: 'border-accent-600 bg-accent-50 text-accent-700' },
  removed: { mark: '−', word: 'removed', cls: 'border-caution-500 bg-caution-50 text-caution-700' },
  changed: { mark: '≠', word: 'changed', cls: 'border-caution-500 bg-caution-50 text-caution-700' },
  same: { mark: '=', word: 'unchanged', cls: 'border-stone-300 bg-white text-stone-600' },
} as const;
type Kind = keyof typeof MARK;

function Tag({ kind }: { kind: Kind }) {
  const m = MARK[kind];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-1.5 text-[11px] font-semibold ${m.cls}`}>
      <span aria-hidden>{m.mark}</span>
      {m.word}
    </span>
  );
}

function show(v: unknown): string {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'number') return formatSignificant(v, 6);
  if (typeof v === 'string') return v === '' ? '“”' : v;
  if (Array.isArray(v) && v.length > 6 && v.every((x) => typeof x === 'number')) return `${v.length} values: ${v.slice(0, 4).map((x) => formatSignificant(x as number, 4)).join(', ')}, …`;
  if (typeof v === 'object' && !Array.isArray(v)) return Object.entries(v as Record<string, unknown>).map(([k, x]) => `${fieldName(k)} ${show(x)}`).join(', ');
  return JSON.stringify(v);
}

/** Line-by-line difference of two model texts (longest common subsequence). */
export function lineDiff(a: string, b: string): { left: (string | null)[]; right: (string | null)[]; kind: Kind[] } {
  const x = a.split('\n');
  const y = b.split('\n');
  const n = x.length;
  const m = y.length;
  const L: number[][] = Array.from({ length: n + 1 }, () => new Array<number>(m + 1).fill(0));
  for (let i = n - 1; i >= 0; i--) for (let j = m - 1; j >= 0; j--) L[i][j] = x[i] === y[j] ? L[i + 1][j + 1] + 1 : Math.max(L[i + 1][j], L[i][j + 1]);
  const left: (string | null)[] = [];
  const right: (string | null)[] = [];
  const kind: Kind[] = [];
  let i = 0;
  let j = 0;
  while (i < n || j < m) {
    if (i < n && j < m && x[i] === y[j]) {
      left.push(x[i++]);
      right.push(y[j++]);
      kind.push('same');
    } else if (i < n && j < m && L[i + 1][j] === L[i][j + 1] && L[i + 1][j + 1] === L[i][j]) {
      // a line replaced by another: show them side by side
      left.push(x[i++]);
      right.push(y[j++]);
      kind.push('changed');
    } else if (j < m && (i >= n || L[i][j + 1] >= L[i + 1][j])) {
      left.push(null);
      right.push(y[j++]);
      kind.push('added');
    } else {
      left.push(x[i++]);
      right.push(null);
      kind.push('removed');
    }
  }
  return { left, right, kind };
}

function Section({ id, title, children, badge }: { id: string; title: string; children: React.ReactNode; badge?: React.ReactNode }) {
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

function ChangeRows({ changes, label }: { changes: FieldChange[]; label?: string }) {
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

function FieldTable({ children, caption }: { children: React.ReactNode; caption: string }) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead className="border-b border-stone-200 text-xs text-stone-700">
        <tr>
          <th scope="col" className="px-2 py-1 font-semibold">Field</th>
          <th scope="col" className="px-2 py-1 font-semibold">Before</th>
          <th scope="col" className="px-2 py-1 font-semibold">After</th>
          <th scope="col" className="px-2 py-1 font-semibold"><span className="sr-only">Change</span></th>
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}

function KeyedSection({ id, title, diff, noun }: { id: string; title: string; diff: KeyedDiff; noun: string }) {
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

function deltaKind(d: Delta): Kind {
  if (d.from === null && d.to !== null) return 'added';
  if (d.from !== null && d.to === null) return 'removed';
  return d.delta === 0 || d.delta === null ? 'same' : 'changed';
}

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

function ResultSection({ d, unit }: { d: BudgetDiff; unit: string }) {
  const rows = compareResults(d.result);
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">The result in both versions</caption>
      <thead className="border-b border-stone-200 text-xs text-stone-700">
        <tr>
          <th scope="col" className="px-2 py-1 text-left font-semibold">Quantity</th>
          <th scope="col" className="px-2 py-1 text-right font-semibold">v{d.from}</th>
          <th scope="col" className="px-2 py-1 text-right font-semibold">v{d.to}</th>
          <th scope="col" className="px-2 py-1 text-left font-semibold">Change</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => {
          const k = deltaKind(r.delta);
          return (
            <tr key={r.label} data-change={k} className={`border-b border-stone-100 last:border-0 ${k !== 'same' ? 'bg-caution-50/50' : ''}`}>
              <th scope="row" className="px-2 py-1 text-left font-medium">
                {r.label}
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

function ContributionsSection({ d, unit }: { d: BudgetDiff; unit: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Each contribution in both versions</caption>
        <thead className="border-b border-stone-200 text-xs text-stone-700">
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-semibold">Xᵢ</th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">u(xᵢ) v{d.from}</th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">u(xᵢ) v{d.to}</th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">|cᵢ|·u(xᵢ) v{d.from}</th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">|cᵢ|·u(xᵢ) v{d.to}</th>
            <th scope="col" className="px-2 py-1 text-left font-semibold">Change of |cᵢ|·u(xᵢ){unit ? ` / ${unit}` : ''}</th>
            <th scope="col" className="px-2 py-1 text-right font-semibold">Share v{d.from} → v{d.to}</th>
          </tr>
        </thead>
        <tbody>
          {compareContributions(d.result).map((c) => {
            const k = deltaKind(c.contribution.delta);
            return (
              <tr key={c.symbol} data-testid={`contribution-${c.symbol}`} data-change={k} className={`border-b border-stone-100 last:border-0 ${k === 'same' ? '' : k === 'added' ? 'bg-accent-50/60' : 'bg-caution-50/50'}`}>
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

function ModelSection({ d }: { d: BudgetDiff }) {
  const ld = lineDiff(d.model.from, d.model.to);
  const cell = (text: string | null, k: Kind, side: 'left' | 'right') => {
    const hit = k !== 'same' && text !== null;
    const tone = !hit ? '' : side === 'left' ? 'bg-caution-50 text-caution-700' : k === 'added' ? 'bg-accent-50 text-accent-700' : 'bg-caution-50 text-stone-900';
    const mark = !hit ? ' ' : side === 'left' ? '−' : k === 'added' ? '+' : '≠';
    return (
      <td className={`num whitespace-pre-wrap break-all px-2 py-0.5 align-top text-[13px] ${tone}`}>
        <span aria-hidden className="mr-2 select-none text-stone-500">{mark}</span>
        {hit ? <span className="sr-only">{side === 'left' ? 'removed: ' : k === 'added' ? 'added: ' : 'changed to: '}</span> : null}
        {text ?? ''}
      </td>
    );
  };
  return (
    <table className="w-full table-fixed border-collapse rounded-md border border-stone-200">
      <caption className="sr-only">Model lines, version {d.from} on the left and version {d.to} on the right</caption>
      <thead className="text-xs text-stone-700">
        <tr className="border-b border-stone-200">
          <th scope="col" className="px-2 py-1 text-left font-semibold">v{d.from}</th>
          <th scope="col" className="border-l border-stone-200 px-2 py-1 text-left font-semibold">v{d.to}</th>
        </tr>
      </thead>
      <tbody>
        {ld.kind.map((k, i) => (
          <tr key={i} data-change={k} className="border-b border-stone-100 last:border-0">
            {cell(ld.left[i], k, 'left')}
            {cell(ld.right[i], k, 'right')}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function ComparePage({ budgetId, from, to }: { budgetId: number; from?: number; to?: number }) {
  const versions = useVersions(budgetId);
  const budget = useBudgetHeader(budgetId);
  const navigate = useNavigate();
  const list = versions.data ?? [];
  const a = from ?? (list.length > 1 ? list[0].number : undefined);
  const b = to ?? (list.length ? list[list.length - 1].number : undefined);
  const diff = useDiff(budgetId, a, b);
  const unitQ = useQuery({ ...versionUnitQuery(budgetId, b ?? 0), enabled: !!b });
  const unit = formatUnit(unitQ.data?.result.measurand.unit ?? unitQ.data?.document.measurand.unit);
  const meta = (n?: number) => list.find((v) => v.number === n);
  const pick = (key: 'from' | 'to', n: number) => {
    const next = { from: a, to: b, [key]: n };
    navigate(`/budgets/${budgetId}/compare?from=${next.from}&to=${next.to}`, { replace: true });
  };
  const d = diff.data;
  const nothing = d && !d.model.changed && !d.measurand.length && !d.other.length && [d.inputs, d.constants, d.correlations].every((x) => !x.added.length && !x.removed.length && !x.changed.length);

  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4 px-6 py-6">
      <Breadcrumb
        trail={[
          { label: 'Budgets', to: '/budgets' },
          { label: budget.data?.title ?? `budget ${budgetId}`, to: `/budgets/${budgetId}` },
          { label: 'versions', to: `/budgets/${budgetId}/versions` },
          { label: 'compare' },
        ]}
      />
      <h1 className="text-2xl font-semibold tracking-tight">Compare versions</h1>
      {versions.isPending ? (
        <Spinner label="Loading versions" />
      ) : versions.isError ? (
        <ErrorNote title="The versions could not be loaded">{errorMessage(versions.error)}</ErrorNote>
      ) : list.length < 2 ? (
        <EmptyState title="Only one version">A comparison needs two versions. Save a change to create the second.</EmptyState>
      ) : (
        <>
          <div className="grid gap-3 rounded-lg border border-stone-200 bg-white p-3 sm:grid-cols-2">
            {(['from', 'to'] as const).map((key) => {
              const n = key === 'from' ? a : b;
              const m = meta(n);
              return (
                <div key={key} className="flex flex-col gap-1">
                  <Field label={key === 'from' ? 'Before (older side)' : 'After (newer side)'}>
                    {(p) => (
                      <Select {...p} value={n ?? ''} onChange={(e) => pick(key, Number(e.target.value))}>
                        {list.map((v) => (
                          <option key={v.number} value={v.number}>
                            v{v.number} · {v.authorName} · {formatDateTime(v.createdAt)}
                            {budget.data ? ` · ${statusLabel(versionStatus(budget.data, v)).toLowerCase()}` : ''}
                          </option>
                        ))}
                      </Select>
                    )}
                  </Field>
                  {m ? (
                    <p className="flex flex-wrap items-center gap-2 text-xs text-stone-600">
                      {budget.data ? <StatusBadge status={versionStatus(budget.data, m)} /> : null}
                      {m.note || 'no note'}
                    </p>
                  ) : null}
                </div>
              );
            })}
          </div>
          {a === b ? (
            <p className="text-sm text-stone-700">Both sides show version {a}. Pick two different versions.</p>
          ) : diff.isPending ? (
            <Spinner label="Comparing" />
          ) : diff.isError ? (
            <ErrorNote title="The comparison failed">{errorMessage(diff.error)}</ErrorNote>
          ) : d ? (
            <div className="flex flex-col gap-4" data-testid="comparison">
              {a !== undefined && b !== undefined && a > b ? (
                <p className="rounded-md border border-stone-300 bg-stone-50 px-3 py-2 text-sm text-stone-700">
                  The older version is on the right.{' '}
                  <Button size="sm" variant="ghost" onClick={() => navigate(`/budgets/${budgetId}/compare?from=${b}&to=${a}`, { replace: true })}>
                    Swap sides
                  </Button>
                </p>
              ) : null}
              {nothing ? <p className="text-sm text-stone-700">The budget documents are identical; only the results below can differ (a different engine version).</p> : null}
              <Section id="cmp-result" title="Result" badge={<Tag kind={deltaKind(d.result.expandedUncertainty)} />}>
                <ResultSection d={d} unit={unit} />
              </Section>
              <Section id="cmp-model" title="Model" badge={<Tag kind={d.model.changed ? 'changed' : 'same'} />}>
                <ModelSection d={d} />
              </Section>
              <KeyedSection id="inputs" title="Input quantities" diff={d.inputs} noun="input" />
              <Section id="cmp-contrib" title="Contributions" badge={<Tag kind={d.result.contributions.some((c) => deltaKind(c.contribution) !== 'same') ? 'changed' : 'same'} />}>
                <ContributionsSection d={d} unit={unit} />
              </Section>
              {d.measurand.length || d.other.length ? (
                <Section id="cmp-other" title="Measurand and settings" badge={<Tag kind="changed" />}>
                  <FieldTable caption="Changed measurand fields and settings">
                    <ChangeRows changes={d.measurand} label="measurand" />
                    <ChangeRows changes={d.other} />
                  </FieldTable>
                </Section>
              ) : null}
              <KeyedSection id="constants" title="Constants" diff={d.constants} noun="constant" />
              <KeyedSection id="correlations" title="Correlations" diff={d.correlations} noun="correlation" />
            </div>
          ) : null}
        </>
      )}
    </div>
  );
}
