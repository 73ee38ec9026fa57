import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetStatus } from '../../../../shared/policy/policy';

export interface VersionRow {
  number: number;
  authorId: number;
  authorName: string;
  createdAt: number;
  note: string;
  seed: string;
  engineVersion: string;
  documentSha256: string;
  approvedBy: number | null;
  approvedAt: number | null;
}

export interface BudgetHeader {
  id: number;
  title: string;
  status: BudgetStatus;
  returned: boolean;
  currentVersion: number;
  approvedVersion: number | null;
  ownerId: number;
}

export const versionsQuery = (id: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions'],
    queryFn: () => api<VersionRow[]>(`/api/budgets/${id}/versions`),
  });

export const budgetHeaderQuery = (id: number) =>
  queryOptions({
    queryKey: ['budgets', id],
    queryFn: () => api<BudgetHeader>(`/api/budgets/${id}`),
  });

export function useVersions(id: number) {
  return useQuery(versionsQuery(id));
}

export function useBudgetHeader(id: number) {
  return useQuery(budgetHeaderQuery(id));
}
