import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetResult } from '../../../../shared/budget/result';
import type { BudgetDocument } from '../../../../shared/budget/schema';
import { can, type BudgetStatus, type Role } from '../../../../shared/policy/policy';

export interface ReportVersion {
  budgetId: number;
  number: number;
  authorId: number;
  createdAt: number;
  note: string;
  seed: string;
  engineVersion: string;
  documentSha256: string;
  approvedBy: number | null;
  approvedAt: number | null;
  document: BudgetDocument;
  result: BudgetResult;
}

export interface ReportBudget {
  id: number;
  title: string;
  status: BudgetStatus;
  returned: boolean;
  currentVersion: number;
  approvedVersion: number | null;
}

export const reportVersionQuery = (id: number, n: number) =>
  queryOptions({
    queryKey: ['budgets', id, 'versions', n],
    queryFn: () => api<ReportVersion>(`/api/budgets/${id}/versions/${n}`),
    staleTime: Infinity,
  });

/**
 * Names of people who are not version authors (the approver): from the user
 * list for admins, from the approval's audit entry for auditors.
 */
function usePeople(id: number, role: Role) {
  const admin = can(role, 'user.manage');
  const auditor = !admin && can(role, 'audit.read');
  return useQuery({
    queryKey: ['budgets', id, 'report-people', role],
    enabled: admin || auditor,
    queryFn: async (): Promise<[number, string][]> => {
      if (admin) return (await api<{ id: number; name: string }[]>('/api/users')).map((u) => [u.id, u.name]);
      const r = await api<{ events: { actorId: number | null; actorEmail: string | null; detail: Record<string, unknown> }[] }>(`/api/audit?budget=${id}&action=budget.approved`);
      return r.events.filter((e) => e.actorId !== null).map((e) => [e.actorId!, String(e.detail.signedBy ?? e.actorEmail ?? `user #${e.actorId}`)]);
    },
  });
}

export function useReport(id: number, n: number, role: Role) {
  const people = usePeople(id, role);
  const version = useQuery(reportVersionQuery(id, n));
  const budget = useQuery({ queryKey: ['budgets', id], queryFn: () => api<ReportBudget>(`/api/budgets/${id}`) });
  const versions = useQuery({
    queryKey: ['budgets', id, 'versions'],
    queryFn: () => api<{ number: number; authorId: number; authorName: string }[]>(`/api/budgets/${id}/versions`),
  });
  return { version, budget, versions, people };
}

export function reportPdfUrl(id: number, n: number): string {
  return `/api/budgets/${id}/versions/${n}/report.pdf`;
}
