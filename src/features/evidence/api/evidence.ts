import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { AddedAttachment, Attachment } from '../../../../shared/api/uploads';

export const evidenceQuery = (budgetId: number, version: number) =>
  queryOptions({
    queryKey: ['budgets', budgetId, 'attachments', version],
    queryFn: () => api<Attachment[]>(`/api/budgets/${budgetId}/attachments?version=${version}`),
  });

export function useEvidence(budgetId: number, version: number) {
  return useQuery(evidenceQuery(budgetId, version));
}

/** Sends one file as a multipart form; the server sniffs its type and keeps it by its SHA-256. */
export function useAttachEvidence(budgetId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, symbol }: { file: File; symbol: string | null }) => {
      const form = new FormData();
      if (symbol) form.append('symbol', symbol);
      form.append('file', file);
      return api<AddedAttachment>(`/api/budgets/${budgetId}/attachments`, { method: 'POST', body: form });
    },
    onSuccess: (a) => {
      qc.invalidateQueries({ queryKey: ['budgets', budgetId, 'attachments'] });
      qc.invalidateQueries({ queryKey: ['budgets', budgetId, 'review'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
      if (a.newVersion) {
        qc.invalidateQueries({ queryKey: ['budgets', budgetId] });
        qc.invalidateQueries({ queryKey: ['budgets', 'list'] });
      }
    },
  });
}
