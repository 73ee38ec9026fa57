import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetView, VersionMeta, VersionView } from '../../../../shared/api/budgets';
import type { BudgetDiff } from '../../../../shared/api/diff';

export const versionsQuery = (id: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions'],
    queryFn: () => api<VersionMeta[]>(`/api/budgets/${id}/versions`),
  });

export const budgetHeaderQuery = (id: number) =>
  queryOptions({
    queryKey: ['budgets', id],
    queryFn: () => api<BudgetView>(`/api/budgets/${id}`),
  });

export function useVersions(id: number) {
  return useQuery(versionsQuery(id));
}

export function useBudgetHeader(id: number) {
  return useQuery(budgetHeaderQuery(id));
}

export const diffQuery = (id: number, from: number, to: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'diff', from, to],
    queryFn: () => api<BudgetDiff>(`/api/budgets/${id}/diff?from=${from}&to=${to}`),
    staleTime: Infinity,
  });

export function useDiff(id: number, from: number | undefined, to: number | undefined) {
  return useQuery({ ...diffQuery(id, from ?? 0, to ?? 0), enabled: !!from && !!to && from !== to });
}

/** The measurand unit of a version, for the result table of a comparison. */
export const versionUnitQuery = (id: number, n: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions', n],
    queryFn: () => api<VersionView>(`/api/budgets/${id}/versions/${n}`),
    staleTime: Infinity,
  });
