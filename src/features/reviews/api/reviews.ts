import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetStatus } from '../../../../shared/policy/policy';

export interface Comment {
  id: number;
  budgetId: number;
  versionNumber: number;
  /** The quantity the comment is pinned to, or null for the whole budget. */
  symbol: string | null;
  authorId: number;
  body: string;
  resolved: boolean;
  resolvedBy: number | null;
  resolvedAt: number | null;
  createdAt: number;
}

export interface TransitionOutput {
  status: BudgetStatus;
  version: number;
  returned: boolean;
}

export type TransitionInput =
  | { to: 'in_review' }
  | { to: 'approved'; password: string }
  | { to: 'draft'; comment: string };

export const commentsQuery = (budgetId: number) =>
  queryOptions({
    queryKey: ['budgets', budgetId, 'comments'],
    queryFn: () => api<Comment[]>(`/api/budgets/${budgetId}/comments`),
  });

export function useComments(budgetId: number | undefined) {
  return useQuery({ ...commentsQuery(budgetId ?? 0), enabled: budgetId !== undefined });
}

/** A reply has no parent field on the server: it is a comment on the same quantity whose text starts with a reference. */
const REPLY = /^\[re #(\d+)\]\s*/;

export function replyTarget(body: string): { to: number | null; text: string } {
  const m = REPLY.exec(body);
  return m ? { to: Number(m[1]), text: body.slice(m[0].length) } : { to: null, text: body };
}

export function replyBody(to: number | null, text: string): string {
  return to ? `[re #${to}] ${text}` : text;
}

export function useAddComment(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { version: number; symbol: string | null; body: string }) =>
      api<Comment>(`/api/budgets/${budgetId}/comments`, { method: 'POST', json: { version: input.version, symbol: input.symbol, body: input.body } }),
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

/** Names for author ids: the version authors of the budget are known to every reader. */
export interface People {
  nameOf(id: number): string;
}
