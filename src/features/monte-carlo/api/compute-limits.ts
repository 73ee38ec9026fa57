import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ComputeLimits } from '../../../../shared/api/budgets';
import { api } from '../../../app/http';

/** The server's trials cap and default trials: the panel never runs more than a save would store. */
export const computeLimitsQuery = () =>
  queryOptions({
    queryKey: ['compute-limits'],
    queryFn: () => api<ComputeLimits>('/api/config'),
    staleTime: Infinity,
  });

export function useComputeLimits() {
  return useQuery(computeLimitsQuery());
}
