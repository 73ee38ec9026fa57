import { useQuery } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { errorMessage } from '../../../app/http';
import { Breadcrumb } from '../../../app/ui/breadcrumb';
import { Button, EmptyState, ErrorNote, Field, Select, Spinner } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { StatusBadge, statusLabel } from '../../../budget/components/StatusBadge';
import { versionStatus } from '../../../../shared/policy/version-status';
import { formatUnit } from '../../../app/ui/units';
import { versionQuery as versionUnitQuery } from '../../../budget/queries';
import { useBudgetHeader, useDiff, useVersions } from '../api/versions';
import { ChangeRows, deltaKind, FieldTable, Section, Tag } from './CompareParts';
import { ContributionsSection, ResultSection } from './CompareResults';
import { KeyedSection } from './KeyedSection';
import { ModelDiff } from './ModelDiff';

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
                <ModelDiff d={d} />
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
