import { useQuery } from '@tanstack/react-query';
import { budgetQuery, diffQuery, versionListQuery, versionPageQuery } from '../../../budget/queries';
import type { PageRequest } from '../../../budget/query-keys';

/** Every version, oldest first (the comparison picks among them). */
export function useVersions(id: number) {
  return useQuery(versionListQuery(id));
}

/** One page of the history, paged and ordered by the server. */
export function useVersionPage(id: number, page: PageRequest<'number'>) {
  return useQuery(versionPageQuery(id, page));
}

export function useBudgetHeader(id: number) {
  return useQuery(budgetQuery(id));
}

export function useDiff(id: number, from: number | undefined, to: number | undefined) {
  return useQuery({ ...diffQuery(id, from ?? 0, to ?? 0), enabled: !!from && !!to && from !== to });
}
