import type { ColumnDef } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { BudgetView, VersionMeta } from '../../../../shared/api/budgets';
import type { Role } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { SORT_ORDERS, useListParams } from '../../../app/search-params';
import { Breadcrumb } from '../../../app/ui/breadcrumb';
import { Button, EmptyState, ErrorNote, Field, Select, Spinner } from '../../../app/ui/controls';
import { DataTable, useKeepPageInRange } from '../../../app/ui/data-table';
import { formatDateTime } from '../../../app/ui/numbers';
import { StatusBadge } from '../../../budget/components/StatusBadge';
import { versionStatus } from '../../../../shared/policy/version-status';
import { useBudgetHeader, useVersionPage } from '../api/versions';

const PAGE_SIZE = 20;

/** Pick any two versions and open their side-by-side comparison (versions are numbered 1 to the current one). */
function CompareForm({ budgetId, current }: { budgetId: number; current: number }) {
  const navigate = useNavigate();
  const versions = Array.from({ length: current }, (_, i) => ({ number: i + 1 }));
  const [from, setFrom] = useState(1);
  const [to, setTo] = useState(current);
  const same = from === to;
  const pick = (label: string, value: number, onPick: (n: number) => void, error: string | null = null) => (
    <Field label={label} className="w-40" error={error}>
      {(p) => (
        <Select {...p} value={value} onChange={(e) => onPick(Number(e.target.value))}>
          {versions.map((v) => (
            <option key={v.number} value={v.number}>
              v{v.number}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
  return (
    <form
      aria-label="Compare two versions"
      className="flex flex-wrap items-end gap-3 rounded-lg border border-stone-200 bg-white p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!same) navigate(`/budgets/${budgetId}/compare?from=${from}&to=${to}`);
      }}
    >
      {pick('Compare version', from, setFrom)}
      {pick('with version', to, setTo, same ? 'Pick two different versions.' : null)}
      <Button type="submit" variant="primary" disabled={same}>
        Compare
      </Button>
    </form>
  );
}

function versionColumns(budgetId: number, b: BudgetView | undefined): ColumnDef<VersionMeta, unknown>[] {
  return [
    { id: 'number', accessorFn: (v) => v.number, header: 'Version', enableHiding: false, meta: { className: 'num text-right font-semibold' }, cell: ({ row: { original: v } }) => `v${v.number}` },
    { id: 'saved', header: 'Saved', enableSorting: false, meta: { className: 'whitespace-nowrap text-stone-700' }, cell: ({ row: { original: v } }) => formatDateTime(v.createdAt) },
    { id: 'author', header: 'Author', enableSorting: false, cell: ({ row: { original: v } }) => v.authorName },
    {
      id: 'note',
      header: 'Change note',
      enableSorting: false,
      meta: { className: 'text-stone-800' },
      cell: ({ row: { original: v } }) => v.note || <span className="text-stone-500">no note</span>,
    },
    {
      id: 'status',
      header: 'Status',
      enableSorting: false,
      cell: ({ row: { original: v } }) => (
        <div className="flex flex-wrap gap-1">
          {b ? <StatusBadge status={versionStatus(b, v)} /> : null}
          {v.approvedAt ? <span className="text-xs text-stone-600">{formatDateTime(v.approvedAt)}</span> : null}
          {b?.currentVersion === v.number ? <span className="rounded-full border border-stone-300 px-2 py-0.5 text-xs text-stone-700">current</span> : null}
        </div>
      ),
    },
    { id: 'seed', header: 'Seed', enableSorting: false, meta: { className: 'num text-xs text-stone-700' }, cell: ({ row: { original: v } }) => v.seed },
    {
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      enableSorting: false,
      enableHiding: false,
      meta: { className: 'whitespace-nowrap text-right', label: 'Actions' },
      cell: ({ row: { original: v } }) => (
        <>
          <Link to={b?.currentVersion === v.number ? `/budgets/${budgetId}` : `/budgets/${budgetId}/versions/${v.number}`} className="text-accent-700 hover:underline">
            Open
          </Link>
          <span className="mx-1 text-stone-400">·</span>
          <a href={`/api/budgets/${budgetId}/export?version=${v.number}`} download className="text-accent-700 hover:underline">
            Export
          </a>
          <span className="mx-1 text-stone-400">·</span>
          <Link to={`/budgets/${budgetId}/versions/${v.number}/report`} className="text-accent-700 hover:underline" aria-label={`Report of version ${v.number}`}>
            Report
          </Link>
        </>
      ),
    },
  ];
}

export function VersionsPage({ budgetId }: { me: { id: number; role: Role }; budgetId: number }) {
  const list = useListParams();
  const { set, page } = list;
  const order = list.oneOf('order', SORT_ORDERS, 'desc');
  const versions = useVersionPage(budgetId, { limit: PAGE_SIZE, offset: (page - 1) * PAGE_SIZE, order });
  useKeepPageInRange(page, versions.data?.total, PAGE_SIZE, (n) => set({ page: String(n) }));
  const budget = useBudgetHeader(budgetId);
  const b = budget.data;
  const columns = useMemo(() => versionColumns(budgetId, b), [budgetId, b]);
  return (
    <div className="mx-auto flex max-w-5xl flex-col gap-4 px-6 py-6">
      <Breadcrumb trail={[{ label: 'Budgets', to: '/budgets' }, { label: b?.title ?? `budget ${budgetId}`, to: `/budgets/${budgetId}` }, { label: 'versions' }]} />
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold tracking-tight">Version history</h1>
        {b ? <StatusBadge status={b.status} returned={b.returned} prefix="budget now:" /> : null}
      </div>
      <p className="text-sm text-stone-600">Every save creates a version; versions never change. Each row shows that version's own status: an older draft that was never approved is superseded.</p>
      {b && b.currentVersion > 1 ? <CompareForm key={b.currentVersion} budgetId={budgetId} current={b.currentVersion} /> : null}
      {versions.isPending ? (
        <Spinner label="Loading versions" />
      ) : versions.isError ? (
        <ErrorNote title="The versions could not be loaded">{errorMessage(versions.error)}</ErrorNote>
      ) : (
        <DataTable
          id="versions"
          caption={`Versions of the budget, ${order === 'asc' ? 'oldest' : 'newest'} first`}
          data={versions.data.rows}
          columns={columns}
          getRowId={(v) => String(v.number)}
          busy={versions.isPlaceholderData}
          sorting={{ sort: 'number', order, onSort: (_key, o) => set({ order: o === 'asc' ? 'asc' : undefined }) }}
          paging={{ page, pageSize: PAGE_SIZE, total: versions.data.total, onPage: (n) => set({ page: String(n) }) }}
          rowProps={(v) => ({ className: `border-b border-stone-100 last:border-0 ${b?.currentVersion === v.number ? 'bg-stone-50' : ''}` })}
          empty={<EmptyState title="No versions" />}
        />
      )}
    </div>
  );
}
