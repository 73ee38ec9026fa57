import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetListItem, CreatedBudget } from '../../../../shared/api/budgets';
import type { BudgetStatus } from '../../../../shared/policy/policy';

export interface BudgetListFilter {
  status?: BudgetStatus;
  owner?: number;
  q?: string;
}

/** The server's largest page of the list. */
const PAGE = 1000;

function listUrl(f: BudgetListFilter, offset: number): string {
  const p = new URLSearchParams();
  if (f.status) p.set('status', f.status);
  if (f.owner) p.set('owner', String(f.owner));
  if (f.q) p.set('q', f.q);
  p.set('limit', String(PAGE));
  p.set('offset', String(offset));
  return `/api/budgets?${p}`;
}

/** Every matching budget (the page sorts and pages in the browser): page after page until a short one. */
async function fetchAll(f: BudgetListFilter): Promise<BudgetListItem[]> {
  const all: BudgetListItem[] = [];
  for (;;) {
    const page = await api<BudgetListItem[]>(listUrl(f, all.length));
    all.push(...page);
    if (page.length < PAGE) return all;
  }
}

export const budgetListQuery = (f: BudgetListFilter) =>
  queryOptions({
    queryKey: ['budgets', 'list', f],
    queryFn: () => fetchAll(f),
    placeholderData: keepPreviousData,
  });

export function useBudgetList(f: BudgetListFilter) {
  return useQuery(budgetListQuery(f));
}

/** Imports a budget file (multipart upload): the server validates, computes and stores version 1. */
export function useImportBudget() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.set('file', file);
      form.set('note', `imported from ${file.name}`.slice(0, 2000));
      return api<CreatedBudget>('/api/budgets/import', { method: 'POST', body: form });
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: ['budgets'] }),
  });
}
