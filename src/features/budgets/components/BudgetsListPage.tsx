import type { ColumnDef } from '@tanstack/react-table';
import { useRef } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { BudgetListItem, BudgetSort } from '../../../../shared/api/budgets';
import { can, type Role } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { useListParams, useSearchText } from '../../../app/search-params';
import { Button, EmptyState, ErrorNote, Field, Select, Spinner } from '../../../app/ui/controls';
import { ClearFilters, DataTable, SearchField, useKeepPageInRange } from '../../../app/ui/data-table';
import { formatDateTime } from '../../../app/ui/numbers';
import { useToast } from '../../../app/ui/toasts';
import { StatusBadge, statusLabel } from '../../../budget/components/StatusBadge';
import { useBudgetList, useBudgetOwners, useImportBudget } from '../api/budgets';
import { BUDGET_PAGE_SIZE as PAGE_SIZE, budgetListRequest } from '../api/list-request';

const SORT_WORDS: Record<BudgetSort, string> = { title: 'title', status: 'status', owner: 'owner', version: 'version', updated: 'last change' };

const COLUMNS: ColumnDef<BudgetListItem, unknown>[] = [
  {
    id: 'title',
    accessorFn: (b) => b.title,
    header: 'Title',
    enableHiding: false,
    meta: { className: 'w-1/2' },
    cell: ({ row: { original: b } }) => (
      <Link to={`/budgets/${b.id}`} className="font-medium text-stone-900 underline-offset-2 hover:text-accent-700 hover:underline">
        {b.title}
      </Link>
    ),
  },
  { id: 'status', accessorFn: (b) => b.status, header: 'Status', cell: ({ row: { original: b } }) => <StatusBadge status={b.status} returned={b.returned} /> },
  { id: 'owner', accessorFn: (b) => b.ownerName, header: 'Owner', meta: { className: 'text-stone-700' }, cell: ({ row: { original: b } }) => b.ownerName },
  {
    id: 'version',
    accessorFn: (b) => b.currentVersion,
    header: 'Version',
    meta: { className: 'num text-right' },
    cell: ({ row: { original: b } }) => (
      <Link to={`/budgets/${b.id}/versions`} className="hover:text-accent-700 hover:underline" aria-label={`v${b.currentVersion}, versions of ${b.title}`}>
        v{b.currentVersion}
      </Link>
    ),
  },
  { id: 'updated', accessorFn: (b) => b.updatedAt, header: 'Last change', meta: { className: 'whitespace-nowrap text-stone-700' }, cell: ({ row: { original: b } }) => formatDateTime(b.updatedAt) },
];

export function BudgetsListPage({ role }: { role: Role }) {
  const list = useListParams();
  const { params, set, clear, filtered } = list;
  const search = useSearchText(list);
  const { status, owner, sort, dir, page, query } = budgetListRequest(params, search.query);
  const budgets = useBudgetList(query);
  useKeepPageInRange(page, budgets.data?.total, PAGE_SIZE, (n) => set({ page: String(n) }));
  const owners = useBudgetOwners();

  const navigate = useNavigate();
  const toast = useToast();
  const importBudget = useImportBudget();
  const fileRef = useRef<HTMLInputElement>(null);
  const canCreate = can(role, 'budget.create');

  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4 px-6 py-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold tracking-tight">Budgets</h1>
          <p className="text-sm text-stone-600">Uncertainty budgets of the laboratory, newest first.</p>
        </div>
        {canCreate ? (
          <div className="flex gap-2">
            <input
              ref={fileRef}
              type="file"
              accept=".json,application/json"
              className="sr-only"
              aria-label="Budget file to import"
              tabIndex={-1}
              onChange={(e) => {
                const f = e.target.files?.[0];
                e.target.value = '';
                if (!f) return;
                importBudget.mutate(f, {
                  onSuccess: (r) => {
                    toast(`Imported “${f.name}” as version 1.`);
                    navigate(`/budgets/${r.id}`);
                  },
                  onError: (err) => toast(`Import refused: ${errorMessage(err)}`, 'error'),
                });
              }}
            />
            <Button onClick={() => fileRef.current?.click()} disabled={importBudget.isPending}>
              {importBudget.isPending ? 'Importing…' : 'Import file'}
            </Button>
            <Button variant="primary" onClick={() => navigate('/budgets/new')}>
              New budget
            </Button>
          </div>
        ) : null}
      </div>

      <form role="search" className="grid grid-cols-1 gap-3 rounded-lg border border-stone-200 bg-white p-3 sm:grid-cols-[2fr_1fr_1fr_auto]" onSubmit={(e) => e.preventDefault()}>
        <SearchField label="Search titles" placeholder="e.g. gauge block" search={search} />
        <Field label="Status">
          {(p) => (
            <Select {...p} value={status} onChange={(e) => set({ status: e.target.value || undefined })}>
              <option value="">All statuses</option>
              {(['draft', 'returned', 'in_review', 'approved'] as const).map((s) => (
                <option key={s} value={s}>
                  {statusLabel(s)}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Owner">
          {(p) => (
            <Select {...p} value={owner ?? ''} onChange={(e) => set({ owner: e.target.value || undefined })}>
              <option value="">Anyone</option>
              {(owners.data ?? []).map(([id, name]) => (
                <option key={id} value={id}>
                  {name}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <ClearFilters disabled={!filtered} onClear={clear} />
      </form>

      {budgets.isPending ? (
        <Spinner label="Loading budgets" />
      ) : budgets.isError ? (
        <ErrorNote title="The budgets could not be loaded">{errorMessage(budgets.error)}</ErrorNote>
      ) : (
        <DataTable
          id="budgets"
          caption={`Budgets, sorted by ${SORT_WORDS[sort]} (${dir === 'asc' ? 'ascending' : 'descending'})`}
          data={budgets.data.rows}
          columns={COLUMNS}
          getRowId={(b) => String(b.id)}
          busy={budgets.isPlaceholderData}
          sorting={{ sort, order: dir, onSort: (key, order) => set({ sort: key, dir: order }) }}
          paging={{ page, pageSize: PAGE_SIZE, total: budgets.data.total, onPage: (n) => set({ page: String(n) }) }}
          rowProps={() => ({ className: 'border-b border-stone-100 last:border-0 hover:bg-stone-50' })}
          empty={
            filtered ? (
              <EmptyState title="No budget matches these filters">Change the search text, status or owner, or clear the filters.</EmptyState>
            ) : (
              <EmptyState title="No budgets yet">
                {canCreate ? 'Start a new budget, import a budget file, or clone one of the templates.' : 'Budgets appear here once metrologists create them.'}
              </EmptyState>
            )
          }
        />
      )}
    </div>
  );
}
