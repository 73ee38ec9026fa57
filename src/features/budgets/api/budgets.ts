import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetStatus } from '../../../../shared/policy/policy';

export interface BudgetListItem {
  id: number;
  title: string;
  status: BudgetStatus;
  returned: boolean;
  isTemplate: boolean;
  ownerId: number;
  ownerName: string;
  currentVersion: number;
  approvedVersion: number | null;
  createdAt: number;
  updatedAt: number;
}

export interface BudgetListFilter {
  status?: BudgetStatus;
  owner?: number;
  q?: string;
}

function listUrl(f: BudgetListFilter): string {
  const p = new URLSearchParams();
  if (f.status) p.set('status', f.status);
  if (f.owner) p.set('owner', String(f.owner));
  if (f.q) p.set('q', f.q);
  p.set('limit', '1000');
  return `/api/budgets?${p}`;
}

export const budgetListQuery = (f: BudgetListFilter) =>
  queryOptions({
    queryKey: ['budgets', 'list', f],
    queryFn: () => api<BudgetListItem[]>(listUrl(f)),
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
      return api<{ id: number; version: number }>('/api/budgets/import', { method: 'POST', body: form });
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: ['budgets'] }),
  });
}
