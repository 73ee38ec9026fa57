import { useQuery } from '@tanstack/react-query';
import { computeLimitsQuery } from '../../../budget/queries';

/** The server's trials cap and default trials: the panel never runs more than a save would store. */
export function useComputeLimits() {
  return useQuery(computeLimitsQuery());
}
