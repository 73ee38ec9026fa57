import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { BudgetListItem, CreatedBudget } from '../../../../shared/api/budgets';
import { afterVersionStored } from '../../../budget/invalidate';
import { budgetIndexQuery, budgetListQuery } from '../../../budget/queries';

/** One page of the list, filtered and sorted by the server, as the address asks (`budgetListRequest`). */
export function useBudgetList(query: ReturnType<typeof budgetListQuery>) {
  return useQuery(query);
}

function ownersOf(budgets: BudgetListItem[]): [number, string][] {
  const m = new Map<number, string>();
  for (const b of budgets) if (!b.isTemplate) m.set(b.ownerId, b.ownerName);
  return [...m].sort((a, b) => a[1].localeCompare(b[1]));
}

/** The owners of budgets, for the owner filter: read from the budget index the audit trail's filter shares. */
export function useBudgetOwners() {
  return useQuery({ ...budgetIndexQuery(), select: ownersOf });
}

/** Imports a budget file (multipart upload): the server validates, computes and stores version 1. */
export function useImportBudget() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.set('file', file);
      form.set('note', `imported from ${file.name}`.slice(0, 2000));
      return api<CreatedBudget>('/api/budgets/import', { method: 'POST', body: form });
    },
    onSuccess: (r) => afterVersionStored(qc, r.id),
  });
}
