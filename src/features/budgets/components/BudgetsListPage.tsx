import { useDeferredValue, useMemo, useRef, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { BudgetListItem } from '../../../../shared/api/budgets';
import { can, type BudgetStatus, type Role } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { useListParams } from '../../../app/search-params';
import { Button, EmptyState, ErrorNote, Field, Select, Spinner, TextInput } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { Pager } from '../../../app/ui/pager';
import { displayStatus, StatusBadge, statusLabel, type DisplayStatus } from '../../../app/ui/status-badge';
import { useToast } from '../../../app/ui/toasts';
import { useBudgetList, useImportBudget } from '../api/budgets';

type SortKey = 'title' | 'status' | 'owner' | 'version' | 'updated';
const PAGE_SIZE = 12;
const STATUS_ORDER: Record<DisplayStatus, number> = { draft: 0, returned: 1, in_review: 2, approved: 3 };

function compare(a: BudgetListItem, b: BudgetListItem, key: SortKey): number {
  switch (key) {
    case 'title':
      return a.title.localeCompare(b.title);
    case 'status':
      return STATUS_ORDER[displayStatus(a.status, a.returned)] - STATUS_ORDER[displayStatus(b.status, b.returned)];
    case 'owner':
      return a.ownerName.localeCompare(b.ownerName);
    case 'version':
      return a.currentVersion - b.currentVersion;
    case 'updated':
      return a.updatedAt - b.updatedAt;
  }
}

export function BudgetsListPage({ role }: { role: Role }) {
  const { params, set, clear } = useListParams();
  const status = (params.get('status') ?? '') as DisplayStatus | '';
  const owner = Number(params.get('owner') ?? '') || undefined;
  const [text, setText] = useState(params.get('q') ?? '');
  const q = useDeferredValue(text.trim());
  const sort = (params.get('sort') ?? 'updated') as SortKey;
  const dir = params.get('dir') === 'asc' ? 'asc' : 'desc';
  const page = Math.max(1, Number(params.get('page') ?? '1') || 1);

  const serverStatus: BudgetStatus | undefined = status === 'returned' ? 'draft' : status || undefined;
  const list = useBudgetList({ status: serverStatus, owner, q: q || undefined });
  const everyone = useBudgetList({});
  const owners = useMemo(() => {
    const m = new Map<number, string>();
    for (const b of everyone.data ?? []) m.set(b.ownerId, b.ownerName);
    return [...m].sort((a, b) => a[1].localeCompare(b[1]));
  }, [everyone.data]);

  const rows = useMemo(() => {
    let r = list.data ?? [];
    if (status === 'returned') r = r.filter((b) => b.returned);
    else if (status === 'draft') r = r.filter((b) => !b.returned);
    const sorted = [...r].sort((a, b) => compare(a, b, sort) || b.id - a.id);
    return dir === 'asc' ? sorted : sorted.reverse();
  }, [list.data, status, sort, dir]);
  const pages = Math.max(1, Math.ceil(rows.length / PAGE_SIZE));
  const current = Math.min(page, pages);
  const shown = rows.slice((current - 1) * PAGE_SIZE, current * PAGE_SIZE);

  const sortBy = (key: SortKey) => set({ sort: key, dir: sort === key && dir === 'desc' ? 'asc' : 'desc' });

  const navigate = useNavigate();
  const toast = useToast();
  const importBudget = useImportBudget();
  const fileRef = useRef<HTMLInputElement>(null);
  const canCreate = can(role, 'budget.create');
  const filtered = !!(status || owner || q);

  const header = (key: SortKey, label: string, className = '') => {
    const active = sort === key;
    return (
      <th scope="col" aria-sort={active ? (dir === 'asc' ? 'ascending' : 'descending') : 'none'} className={`px-3 py-2 font-semibold ${className}`}>
        <button type="button" onClick={() => sortBy(key)} className="inline-flex items-center gap-1 rounded hover:text-accent-700">
          {label}
          <span aria-hidden className={active ? 'text-accent-700' : 'text-stone-400'}>
            {active ? (dir === 'asc' ? '▲' : '▼') : '↕'}
          </span>
        </button>
      </th>
    );
  };

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
        <Field label="Search titles">
          {(p) => (
            <TextInput
              {...p}
              type="search"
              placeholder="e.g. gauge block"
              value={text}
              onChange={(e) => {
                setText(e.target.value);
                set({ q: e.target.value.trim() || undefined });
              }}
            />
          )}
        </Field>
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
              {owners.map(([id, name]) => (
                <option key={id} value={id}>
                  {name}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <div className="flex items-end">
          <Button
            variant="ghost"
            disabled={!filtered}
            onClick={() => {
              setText('');
              clear();
            }}
          >
            Clear filters
          </Button>
        </div>
      </form>

      {list.isPending ? (
        <Spinner label="Loading budgets" />
      ) : list.isError ? (
        <ErrorNote title="The budgets could not be loaded">{errorMessage(list.error)}</ErrorNote>
      ) : rows.length === 0 ? (
        filtered ? (
          <EmptyState title="No budget matches these filters">Change the search text, status or owner, or clear the filters.</EmptyState>
        ) : (
          <EmptyState title="No budgets yet">
            {canCreate ? 'Start a new budget, import a budget file, or clone one of the templates.' : 'Budgets appear here once metrologists create them.'}
          </EmptyState>
        )
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Budgets, sorted by {sort} ({dir === 'asc' ? 'ascending' : 'descending'})</caption>
            <thead className="border-b border-stone-200 bg-stone-50 text-xs text-stone-700">
              <tr>
                {header('title', 'Title', 'w-1/2')}
                {header('status', 'Status')}
                {header('owner', 'Owner')}
                {header('version', 'Version', 'text-right')}
                {header('updated', 'Last change')}
              </tr>
            </thead>
            <tbody>
              {shown.map((b) => (
                <tr key={b.id} className="border-b border-stone-100 last:border-0 hover:bg-stone-50">
                  <td className="px-3 py-2">
                    <Link to={`/budgets/${b.id}`} className="font-medium text-stone-900 underline-offset-2 hover:text-accent-700 hover:underline">
                      {b.title}
                    </Link>
                  </td>
                  <td className="px-3 py-2">
                    <StatusBadge status={b.status} returned={b.returned} />
                  </td>
                  <td className="px-3 py-2 text-stone-700">{b.ownerName}</td>
                  <td className="num px-3 py-2 text-right">
                    <Link to={`/budgets/${b.id}/versions`} className="hover:text-accent-700 hover:underline" aria-label={`v${b.currentVersion}, versions of ${b.title}`}>
                      v{b.currentVersion}
                    </Link>
                  </td>
                  <td className="whitespace-nowrap px-3 py-2 text-stone-700">{formatDateTime(b.updatedAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <Pager page={current} pages={pages} pageSize={PAGE_SIZE} total={rows.length} onPage={(n) => set({ page: String(n) })} />
        </div>
      )}
    </div>
  );
}
