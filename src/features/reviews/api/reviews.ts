import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { Comment, NewComment, TransitionInput, TransitionOutput } from '../../../../shared/api/reviews';

export const commentsQuery = (budgetId: number) =>
  queryOptions({
    queryKey: ['budgets', budgetId, 'comments'],
    queryFn: () => api<Comment[]>(`/api/budgets/${budgetId}/comments`),
  });

export function useComments(budgetId: number | undefined) {
  return useQuery({ ...commentsQuery(budgetId ?? 0), enabled: budgetId !== undefined });
}

export function useAddComment(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: NewComment) => api<Comment>(`/api/budgets/${budgetId}/comments`, { method: 'POST', json: input }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: commentsQuery(budgetId).queryKey });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

export function useResolveComment(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { id: number; resolved: boolean }) =>
      api<Comment>(`/api/budgets/${budgetId}/comments/${input.id}`, { method: 'PATCH', json: { resolved: input.resolved } }),
    onSuccess: (c) => {
      qc.setQueryData<Comment[]>(commentsQuery(budgetId).queryKey, (list) => list?.map((x) => (x.id === c.id ? c : x)));
      qc.invalidateQueries({ queryKey: commentsQuery(budgetId).queryKey });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

export function useTransition(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: TransitionInput) => api<TransitionOutput>(`/api/budgets/${budgetId}/transitions`, { method: 'POST', json: input }),
    onSuccess: () => {
      // the budget view, its versions (approval time), its comments (a return adds one) and the list
      qc.invalidateQueries({ queryKey: ['budgets', budgetId] });
      qc.invalidateQueries({ queryKey: ['budgets', 'list'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
      qc.invalidateQueries({ queryKey: ['mail'] });
    },
  });
}
