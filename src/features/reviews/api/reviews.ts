import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { Comment, NewComment, ReviewQueueItem, ReviewState, TransitionInput, TransitionOutput } from '../../../../shared/api/reviews';

export const commentsQuery = (budgetId: number) =>
  queryOptions({
    queryKey: ['budgets', budgetId, 'comments'],
    queryFn: () => api<Comment[]>(`/api/budgets/${budgetId}/comments`),
  });

export function useComments(budgetId: number | undefined) {
  return useQuery({ ...commentsQuery(budgetId ?? 0), enabled: budgetId !== undefined });
}

export const reviewStateQuery = (budgetId: number) =>
  queryOptions({
    queryKey: ['budgets', budgetId, 'review'],
    queryFn: () => api<ReviewState>(`/api/budgets/${budgetId}/review`),
  });

export function useReviewState(budgetId: number | undefined) {
  return useQuery({ ...reviewStateQuery(budgetId ?? 0), enabled: budgetId !== undefined });
}

export const reviewQueueQuery = () =>
  queryOptions({
    queryKey: ['budgets', 'review-queue'],
    queryFn: () => api<ReviewQueueItem[]>('/api/reviews/queue'),
  });

export function useReviewQueue(enabled: boolean) {
  return useQuery({ ...reviewQueueQuery(), enabled });
}

export function useAddComment(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: NewComment) => api<Comment>(`/api/budgets/${budgetId}/comments`, { method: 'POST', json: input }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: commentsQuery(budgetId).queryKey });
      qc.invalidateQueries({ queryKey: reviewStateQuery(budgetId).queryKey });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

export function useResolveComment(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { id: number; resolved: boolean }) =>
      api<Comment>(`/api/budgets/${budgetId}/comments/${input.id}`, { method: 'PATCH', json: { resolved: input.resolved } }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: commentsQuery(budgetId).queryKey });
      qc.invalidateQueries({ queryKey: reviewStateQuery(budgetId).queryKey });
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
      qc.invalidateQueries({ queryKey: reviewQueueQuery().queryKey });
      qc.invalidateQueries({ queryKey: ['audit'] });
      qc.invalidateQueries({ queryKey: ['mail'] });
    },
  });
}
