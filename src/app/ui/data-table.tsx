import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type RowData, type SortingState, type Updater, type VisibilityState } from '@tanstack/react-table';
import { useEffect, useState, type HTMLAttributes, type ReactNode } from 'react';
import type { SearchText } from '../search-params';
import { Button, Field, TextInput } from './controls';
import { Pager } from './pager';

declare module '@tanstack/react-table' {
  // the augmentation must repeat the library's type parameters, used or not
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Classes of the column's header and cells (alignment, width). */
    className?: string;
    /** The column's name in the Columns menu, where its header is not plain text. */
    label?: string;
  }
}

type SortOrder = 'asc' | 'desc';

/** The page the server sent: which one, of how many rows in all. */
export interface ServerPaging {
  /** From 1. */
  page: number;
  pageSize: number;
  total: number;
  onPage(page: number): void;
}

/** The order the server sorted the rows in; a header click asks the server for another. */
export interface ServerSorting {
  sort: string;
  order: SortOrder;
  onSort(sort: string, order: SortOrder): void;
}

function storedVisibility(key: string): VisibilityState {
  try {
    const v: unknown = JSON.parse(localStorage.getItem(key) ?? '{}');
    return v && typeof v === 'object' ? (v as VisibilityState) : {};
  } catch {
    return {};
  }
}

/**
 * A list the server filters, sorts and pages: header buttons ask for another order (with
 * `aria-sort` on the sorted column), the pager asks for another page, a Columns menu hides
 * columns (remembered in this browser), and `empty` stands in for a table without rows. The
 * rows are shown as the server sent them; the table never sorts or pages them itself.
 */
export function DataTable<T>({
  id,
  caption,
  data,
  columns,
  getRowId,
  paging,
  sorting,
  empty,
  busy = false,
  rowProps,
  testId,
}: {
  /** Names the table, and where its column choice is kept. */
  id: string;
  caption: string;
  data: T[];
  columns: ColumnDef<T, unknown>[];
  getRowId(row: T): string;
  paging: ServerPaging;
  sorting?: ServerSorting;
  empty: ReactNode;
  /** The rows shown are the previous page's while the next one loads. */
  busy?: boolean;
  rowProps?(row: T): HTMLAttributes<HTMLTableRowElement> & { 'data-testid'?: string };
  testId?: string;
}) {
  const storageKey = `dubito.columns.${id}`;
  const [columnVisibility, setColumnVisibility] = useState<VisibilityState>(() => storedVisibility(storageKey));
  useEffect(() => {
    try {
      localStorage.setItem(storageKey, JSON.stringify(columnVisibility));
    } catch {
      // a browser that keeps nothing shows every column next time
    }
  }, [storageKey, columnVisibility]);

  const sortingState: SortingState = sorting ? [{ id: sorting.sort, desc: sorting.order === 'desc' }] : [];
  const pages = Math.max(1, Math.ceil(paging.total / paging.pageSize));
  // the app does not use the React Compiler; the table object is read afresh on every render
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data,
    columns,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    enableSorting: !!sorting,
    enableSortingRemoval: false,
    enableMultiSort: false,
    pageCount: pages,
    state: { sorting: sortingState, columnVisibility, pagination: { pageIndex: paging.page - 1, pageSize: paging.pageSize } },
    onColumnVisibilityChange: setColumnVisibility,
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = typeof updater === 'function' ? updater(sortingState) : updater;
      if (sorting && next[0]) sorting.onSort(next[0].id, next[0].desc ? 'desc' : 'asc');
    },
  });

  const hideable = table.getAllLeafColumns().filter((c) => c.getCanHide());
  return (
    <div className="flex flex-col gap-2">
      {hideable.length > 0 ? (
        <div className="flex justify-end">
          <details className="relative text-sm">
            <summary className="cursor-pointer list-none rounded-md border border-stone-300 bg-white px-3 py-1.5 font-medium text-stone-800 hover:bg-stone-100">Columns</summary>
            <fieldset className="absolute right-0 z-10 mt-1 flex w-48 flex-col gap-1 rounded-md border border-stone-200 bg-white p-2 shadow-lg">
              <legend className="sr-only">Columns shown in {caption}</legend>
              {hideable.map((c) => (
                <label key={c.id} className="flex items-center gap-2 text-stone-800">
                  <input type="checkbox" checked={c.getIsVisible()} onChange={c.getToggleVisibilityHandler()} />
                  {c.columnDef.meta?.label ?? (typeof c.columnDef.header === 'string' ? c.columnDef.header : c.id)}
                </label>
              ))}
            </fieldset>
          </details>
        </div>
      ) : null}
      {data.length === 0 ? (
        empty
      ) : (
        <div className={`overflow-x-auto rounded-lg border border-stone-200 bg-white ${busy ? 'opacity-60' : ''}`} aria-busy={busy || undefined}>
          <table className="w-full text-left text-sm" data-testid={testId}>
            <caption className="sr-only">{caption}</caption>
            <thead className="border-b border-stone-200 bg-stone-50 text-xs text-stone-700">
              {table.getHeaderGroups().map((g) => (
                <tr key={g.id}>
                  {g.headers.map((h) => {
                    const meta = h.column.columnDef.meta;
                    const sorted = h.column.getIsSorted();
                    const label = h.isPlaceholder ? null : flexRender(h.column.columnDef.header, h.getContext());
                    return (
                      <th
                        key={h.id}
                        scope="col"
                        aria-sort={h.column.getCanSort() ? (sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none') : undefined}
                        className={`px-3 py-2 font-semibold ${meta?.className ?? ''}`}
                      >
                        {h.column.getCanSort() ? (
                          <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 rounded hover:text-accent-700">
                            {label}
                            <span aria-hidden className={sorted ? 'text-accent-700' : 'text-stone-400'}>
                              {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                            </span>
                          </button>
                        ) : (
                          label
                        )}
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) => (
                <tr key={row.id} className="border-b border-stone-100 align-top last:border-0" {...rowProps?.(row.original)}>
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className={`px-3 py-2 ${cell.column.columnDef.meta?.className ?? ''}`}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
          <Pager page={paging.page} pages={pages} pageSize={paging.pageSize} total={paging.total} onPage={paging.onPage} />
        </div>
      )}
    </div>
  );
}

/** Sends a list asked for a page past its last (an old link, a list that shrank) to its last page. */
export function useKeepPageInRange(page: number, total: number | undefined, pageSize: number, onPage: (page: number) => void): void {
  const last = total === undefined ? page : Math.max(1, Math.ceil(total / pageSize));
  useEffect(() => {
    if (page > last) onPage(last);
    // onPage changes with every render of the page; the numbers say when to act
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [page, last]);
}

/** The button beside a list's filters that empties them all; off while no filter is set. */
export function ClearFilters({ disabled, onClear }: { disabled: boolean; onClear(): void }) {
  return (
    <div className="flex items-end">
      <Button variant="ghost" disabled={disabled} onClick={onClear}>
        Clear filters
      </Button>
    </div>
  );
}

/** A list's search box, showing and sending the text of `useSearchText`. */
export function SearchField({ label, placeholder, search }: { label: string; placeholder?: string; search: SearchText }) {
  return <Field label={label}>{(p) => <TextInput {...p} type="search" placeholder={placeholder} value={search.text} onChange={(e) => search.onChange(e.target.value)} />}</Field>;
}
