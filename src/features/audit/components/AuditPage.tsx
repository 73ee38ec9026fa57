import type { ColumnDef } from '@tanstack/react-table';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import type { AuditEvent } from '../../../../shared/api/audit';
import { errorMessage } from '../../../app/http';
import { SORT_ORDERS, useListParams } from '../../../app/search-params';
import { EmptyState, ErrorNote, Field, Select, Spinner, TextInput } from '../../../app/ui/controls';
import { ClearFilters, DataTable, useKeepPageInRange } from '../../../app/ui/data-table';
import { formatDateTime } from '../../../app/ui/numbers';
import type { AuditFilter } from '../../../budget/query-keys';
import { AUDIT_ACTIONS, auditCsvUrl, useAudit, useAuditActors, useAuditBudgets } from '../api/audit';

const PAGE_SIZE = 25;

/** The trail's columns; only time sorts (the server keeps the chain's order, oldest or newest first). */
function auditColumns(budgetTitle: Map<number, string>): ColumnDef<AuditEvent, unknown>[] {
  return [
    {
      id: 'time',
      accessorFn: (e) => e.at,
      header: 'Time',
      enableHiding: false,
      meta: { className: 'num whitespace-nowrap text-xs text-stone-700' },
      cell: ({ row: { original: e } }) => <span title={e.time}>{formatDateTime(e.at)}</span>,
    },
    {
      id: 'actor',
      header: 'Actor',
      enableSorting: false,
      meta: { className: 'text-stone-800' },
      cell: ({ row: { original: e } }) => e.actorEmail ?? (e.actorId ? `user #${e.actorId}` : <span className="text-stone-500">system</span>),
    },
    {
      id: 'action',
      header: 'Action',
      enableSorting: false,
      cell: ({ row: { original: e } }) => <span className="num rounded border border-stone-300 bg-stone-50 px-1.5 py-0.5 text-xs text-stone-800">{e.action}</span>,
    },
    {
      id: 'budget',
      header: 'Budget',
      enableSorting: false,
      cell: ({ row: { original: e } }) =>
        e.budgetId ? (
          <Link to={`/budgets/${e.budgetId}`} className="text-accent-700 hover:underline">
            {budgetTitle.get(e.budgetId) ?? `budget ${e.budgetId}`}
          </Link>
        ) : (
          <span className="text-stone-500">—</span>
        ),
    },
    { id: 'version', header: 'Version', enableSorting: false, meta: { className: 'num text-right' }, cell: ({ row: { original: e } }) => (e.versionNumber ? `v${e.versionNumber}` : '') },
    { id: 'details', header: 'Details', enableSorting: false, meta: { className: 'max-w-md break-words text-xs text-stone-700' }, cell: ({ row: { original: e } }) => e.details },
  ];
}

/** datetime-local text ↔ milliseconds, in the browser's time zone. */
function toLocalInput(ms: number | undefined): string {
  if (ms === undefined) return '';
  const d = new Date(ms);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}
function fromLocalInput(text: string): number | undefined {
  if (!text) return undefined;
  const t = new Date(text).getTime();
  return Number.isFinite(t) ? t : undefined;
}

export function AuditPage() {
  const list = useListParams();
  const { params, set, clear, filtered, page } = list;
  const num = (k: string) => (params.get(k) ? Number(params.get(k)) || undefined : undefined);
  const filter: AuditFilter = { budget: num('budget'), actor: num('actor'), action: params.get('action') ?? undefined, from: num('from'), to: num('to') };
  const order = list.oneOf('order', SORT_ORDERS, 'desc');
  const audit = useAudit(filter, { limit: PAGE_SIZE, offset: (page - 1) * PAGE_SIZE, order });
  useKeepPageInRange(page, audit.data?.total, PAGE_SIZE, (n) => set({ page: String(n) }));
  const actors = useAuditActors();
  const budgets = useAuditBudgets();
  const columns = useMemo(() => auditColumns(new Map((budgets.data ?? []).map((b) => [b.id, b.title]))), [budgets.data]);
  const rangeError = filter.from !== undefined && filter.to !== undefined && filter.from > filter.to ? 'The end of the range is before its start.' : null;

  return (
    <div className="mx-auto flex max-w-7xl flex-col gap-4 px-6 py-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold tracking-tight">Audit trail</h1>
          <p className="text-sm text-stone-600">Every change to budgets, reviews and accounts, newest first unless you sort by time. Entries cannot be edited or deleted.</p>
        </div>
        <a href={auditCsvUrl(filter)} download="dubito-audit.csv" className="inline-flex items-center gap-1.5 rounded-md bg-accent-600 px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-700">
          Export CSV
        </a>
      </div>

      <form
        role="search"
        aria-label="Filter the audit trail"
        className="grid grid-cols-1 gap-3 rounded-lg border border-stone-200 bg-white p-3 sm:grid-cols-2 lg:grid-cols-[2fr_1.5fr_1.5fr_1fr_1fr_auto]"
        onSubmit={(e) => e.preventDefault()}
      >
        <Field label="Budget">
          {(p) => (
            <Select {...p} value={filter.budget ?? ''} onChange={(e) => set({ budget: e.target.value || undefined })}>
              <option value="">All budgets</option>
              {(budgets.data ?? []).map((b) => (
                <option key={b.id} value={b.id}>
                  #{b.id} {b.title}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Actor">
          {(p) => (
            <Select {...p} value={filter.actor ?? ''} onChange={(e) => set({ actor: e.target.value || undefined })}>
              <option value="">Anyone</option>
              {(actors.data ?? []).map(([id, email]) => (
                <option key={id} value={id}>
                  {email}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label="Action">
          {(p) => (
            <Select {...p} value={filter.action ?? ''} onChange={(e) => set({ action: e.target.value || undefined })}>
              <option value="">Every action</option>
              {AUDIT_ACTIONS.map((g) => (
                <optgroup key={g.group} label={g.label}>
                  <option value={g.group}>all {g.label.toLowerCase()} actions</option>
                  {g.actions.map((a) => (
                    <option key={a} value={a}>
                      {a}
                    </option>
                  ))}
                </optgroup>
              ))}
            </Select>
          )}
        </Field>
        <Field label="From">{(p) => <TextInput {...p} type="datetime-local" value={toLocalInput(filter.from)} onChange={(e) => set({ from: fromLocalInput(e.target.value)?.toString() })} />}</Field>
        <Field label="To" error={rangeError}>
          {(p) => <TextInput {...p} type="datetime-local" value={toLocalInput(filter.to)} onChange={(e) => set({ to: fromLocalInput(e.target.value)?.toString() })} />}
        </Field>
        <ClearFilters disabled={!filtered} onClear={clear} />
      </form>

      {audit.isPending ? (
        <Spinner label="Loading the audit trail" />
      ) : audit.isError ? (
        <ErrorNote title="The audit trail could not be loaded">{errorMessage(audit.error)}</ErrorNote>
      ) : (
        <DataTable
          id="audit"
          testId="audit-table"
          caption={`Audit entries ${filtered ? 'matching the filters' : ''}, ${order === 'asc' ? 'oldest' : 'newest'} first`}
          data={audit.data.events}
          columns={columns}
          getRowId={(e) => String(e.id)}
          busy={audit.isPlaceholderData}
          sorting={{ sort: 'time', order, onSort: (_key, o) => set({ order: o === 'asc' ? 'asc' : undefined }) }}
          paging={{ page, pageSize: PAGE_SIZE, total: audit.data.total, onPage: (n) => set({ page: String(n) }) }}
          empty={<EmptyState title={filtered ? 'No entry matches these filters' : 'The audit trail is empty'}>{filtered ? 'Widen the time range or clear the filters.' : null}</EmptyState>}
        />
      )}
    </div>
  );
}
