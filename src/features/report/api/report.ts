import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetView, VersionView } from '../../../../shared/api/budgets';
import type { Attachment } from '../../../../shared/api/uploads';

export const reportVersionQuery = (id: number, n: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions', n],
    queryFn: () => api<VersionView>(`/api/budgets/${id}/versions/${n}`),
    staleTime: Infinity,
  });

/** The version on paper (with its author's and approver's names), the budget's current state and the evidence the version carries. */
export function useReport(id: number, n: number) {
  const version = useQuery(reportVersionQuery(id, n));
  const budget = useQuery({ queryKey: ['budgets', id], queryFn: () => api<BudgetView>(`/api/budgets/${id}`) });
  // the key under which attaching a file refreshes a version's evidence
  const evidence = useQuery({ queryKey: ['budgets', id, 'attachments', n], queryFn: () => api<Attachment[]>(`/api/budgets/${id}/attachments?version=${n}`) });
  return { version, budget, evidence };
}

export function reportPdfUrl(id: number, n: number): string {
  return `/api/budgets/${id}/versions/${n}/report.pdf`;
}
