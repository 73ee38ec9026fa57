import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetView, VersionView } from '../../../../shared/api/budgets';

export const reportVersionQuery = (id: number, n: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions', n],
    queryFn: () => api<VersionView>(`/api/budgets/${id}/versions/${n}`),
    staleTime: Infinity,
  });

/** The version on paper (with its author's and approver's names) and the budget's current state. */
export function useReport(id: number, n: number) {
  const version = useQuery(reportVersionQuery(id, n));
  const budget = useQuery({ queryKey: ['budgets', id], queryFn: () => api<BudgetView>(`/api/budgets/${id}`) });
  return { version, budget };
}

export function reportPdfUrl(id: number, n: number): string {
  return `/api/budgets/${id}/versions/${n}/report.pdf`;
}
