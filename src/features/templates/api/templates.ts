import { queryOptions, useMutation, useQueries, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetStatus } from '../../../../shared/policy/policy';

export interface TemplateItem {
  id: number;
  title: string;
  status: BudgetStatus;
  ownerName: string;
  currentVersion: number;
  updatedAt: number;
}

/** The part of a budget the gallery shows. */
export interface TemplateDetail {
  id: number;
  isTemplate: boolean;
  document: { measurand: { symbol: string; unit?: string; description?: string }; model: string; inputs: { symbol: string }[] };
}

export const templatesQuery = () =>
  queryOptions({
    queryKey: ['templates'],
    queryFn: () => api<TemplateItem[]>('/api/templates'),
  });

export function useTemplates() {
  return useQuery(templatesQuery());
}

/** Each template's document (same cache entry as the budget view). */
export function useTemplateDetails(ids: number[]) {
  return useQueries({
    queries: ids.map((id) => ({
      queryKey: ['budgets', id],
      queryFn: () => api<TemplateDetail>(`/api/budgets/${id}`),
    })),
  });
}

export function useCloneBudget() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, title }: { id: number; title?: string }) => api<{ id: number; version: number }>(`/api/budgets/${id}/clone`, { method: 'POST', json: title ? { title } : {} }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['budgets', 'list'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

export function useSetTemplate() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, isTemplate }: { id: number; isTemplate: boolean }) => api<{ id: number; isTemplate: boolean }>(`/api/budgets/${id}`, { method: 'PATCH', json: { isTemplate } }),
    onSuccess: (_r, v) => {
      qc.invalidateQueries({ queryKey: ['templates'] });
      qc.invalidateQueries({ queryKey: ['budgets', v.id] });
      qc.invalidateQueries({ queryKey: ['budgets', 'list'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}
