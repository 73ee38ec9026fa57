import { useMutation, useQueries, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetSummary, ClonedBudget } from '../../../../shared/api/budgets';
import { afterTemplateChanged, afterVersionStored } from '../../../budget/invalidate';
import { budgetQuery, templatesQuery } from '../../../budget/queries';

export function useTemplates() {
  return useQuery(templatesQuery());
}

/** Each template with its document (the same cache entry as the budget view). */
export function useTemplateDetails(ids: number[]) {
  return useQueries({ queries: ids.map((id) => budgetQuery(id)) });
}

export function useCloneBudget() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, title }: { id: number; title?: string }) => api<ClonedBudget>(`/api/budgets/${id}/clone`, { method: 'POST', json: title ? { title } : {} }),
    onSuccess: (r) => afterVersionStored(qc, r.id),
  });
}

export function useSetTemplate() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, isTemplate }: { id: number; isTemplate: boolean }) => api<BudgetSummary>(`/api/budgets/${id}`, { method: 'PATCH', json: { isTemplate } }),
    onSuccess: (_r, v) => afterTemplateChanged(qc, v.id),
  });
}
