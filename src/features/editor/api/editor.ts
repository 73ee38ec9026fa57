import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { CreatedBudget, SavedVersion } from '../../../../shared/api/budgets';
import type { ObservationsResult } from '../../../../shared/api/uploads';
import type { BudgetResult } from '../../../../shared/budget/result';
import type { BudgetDocument } from '../../../../shared/budget/schema';
import { afterVersionStored } from '../../../budget/invalidate';
import { budgetQuery, versionQuery } from '../../../budget/queries';

export function useBudget(id: number | undefined) {
  return useQuery({ ...budgetQuery(id ?? 0), enabled: id !== undefined });
}

export function useBudgetVersion(id: number | undefined, n: number | undefined) {
  return useQuery({ ...versionQuery(id ?? 0, n ?? 0), enabled: id !== undefined && n !== undefined });
}

export type SaveInput = { kind: 'create'; document: BudgetDocument; note: string } | { kind: 'update'; id: number; baseVersion: number; document: BudgetDocument; note: string };

export interface SaveOutput {
  id: number;
  version: number;
  result: BudgetResult;
}

export function useSaveBudget() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: SaveInput): Promise<SaveOutput> => {
      if (input.kind === 'create') {
        const r = await api<CreatedBudget>('/api/budgets', {
          method: 'POST',
          json: { document: input.document, note: input.note },
        });
        return r;
      }
      const r = await api<SavedVersion>(`/api/budgets/${input.id}`, {
        method: 'PUT',
        json: { baseVersion: input.baseVersion, document: input.document, note: input.note },
      });
      return { id: input.id, ...r };
    },
    onSuccess: (r) => afterVersionStored(qc, r.id),
  });
}

/** Sends a CSV file to the server, which reads one column of numbers (and reports the rows it could not read). */
export function useUploadObservations() {
  return useMutation({
    mutationFn: ({ file, column }: { file: File; column?: string }) => {
      const form = new FormData();
      if (column) form.set('column', column);
      form.set('file', file);
      return api<ObservationsResult>('/api/uploads/observations', { method: 'POST', body: form });
    },
  });
}
