import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { Comment, NewComment, TransitionInput, TransitionOutput } from '../../../../shared/api/reviews';
import { afterCommentChanged, afterReviewDecision } from '../../../budget/invalidate';
import { commentsQuery, reviewQueueQuery, reviewStateQuery } from '../../../budget/queries';

export function useComments(budgetId: number | undefined) {
  return useQuery({ ...commentsQuery(budgetId ?? 0), enabled: budgetId !== undefined });
}

export function useReviewState(budgetId: number | undefined) {
  return useQuery({ ...reviewStateQuery(budgetId ?? 0), enabled: budgetId !== undefined });
}

export function useReviewQueue(enabled: boolean) {
  return useQuery({ ...reviewQueueQuery(), enabled });
}

export function useAddComment(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: NewComment) => api<Comment>(`/api/budgets/${budgetId}/comments`, { method: 'POST', json: input }),
    onSuccess: () => afterCommentChanged(qc, budgetId),
  });
}

export function useResolveComment(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { id: number; resolved: boolean }) => api<Comment>(`/api/budgets/${budgetId}/comments/${input.id}`, { method: 'PATCH', json: { resolved: input.resolved } }),
    onSuccess: () => afterCommentChanged(qc, budgetId),
  });
}

export function useTransition(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: TransitionInput) => api<TransitionOutput>(`/api/budgets/${budgetId}/transitions`, { method: 'POST', json: input }),
    onSuccess: () => afterReviewDecision(qc, budgetId),
  });
}
