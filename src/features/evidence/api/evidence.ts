import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { AddedAttachment } from '../../../../shared/api/uploads';
import { afterEvidenceAdded } from '../../../budget/invalidate';
import { attachmentsQuery } from '../../../budget/queries';

export function useEvidence(budgetId: number, version: number) {
  return useQuery(attachmentsQuery(budgetId, version));
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
    onSuccess: (a) => afterEvidenceAdded(qc, budgetId, a.newVersion),
  });
}
