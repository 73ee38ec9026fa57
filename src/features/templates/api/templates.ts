import { queryOptions, useMutation, useQueries, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetListItem, BudgetSummary, BudgetView, ClonedBudget } from '../../../../shared/api/budgets';

export const templatesQuery = () =>
  queryOptions({
    queryKey: ['templates'],
    queryFn: () => api<BudgetListItem[]>('/api/templates'),
  });

export function useTemplates() {
  return useQuery(templatesQuery());
}

/** Each template with its document (the same cache entry as the budget view). */
export function useTemplateDetails(ids: number[]) {
  return useQueries({
    queries: ids.map((id) => ({
      queryKey: ['budgets', id],
      queryFn: () => api<BudgetView>(`/api/budgets/${id}`),
    })),
  });
}

export function useCloneBudget() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, title }: { id: number; title?: string }) => api<ClonedBudget>(`/api/budgets/${id}/clone`, { method: 'POST', json: title ? { title } : {} }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['budgets', 'list'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

export function useSetTemplate() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, isTemplate }: { id: number; isTemplate: boolean }) => api<BudgetSummary>(`/api/budgets/${id}`, { method: 'PATCH', json: { isTemplate } }),
    onSuccess: (_r, v) => {
      qc.invalidateQueries({ queryKey: ['templates'] });
      qc.invalidateQueries({ queryKey: ['budgets', v.id] });
      qc.invalidateQueries({ queryKey: ['budgets', 'list'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}
