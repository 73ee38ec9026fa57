import { useQuery } from '@tanstack/react-query';
import { attachmentsQuery, budgetQuery, versionQuery } from '../../../budget/queries';

/** The version on paper (with its author's and approver's names), the budget's current state and the evidence the version carries. */
export function useReport(id: number, n: number) {
  const version = useQuery(versionQuery(id, n));
  const budget = useQuery(budgetQuery(id));
  const evidence = useQuery(attachmentsQuery(id, n));
  return { version, budget, evidence };
}

export function reportPdfUrl(id: number, n: number): string {
  return `/api/budgets/${id}/versions/${n}/report.pdf`;
}
