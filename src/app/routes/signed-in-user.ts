import { useOutletContext } from 'react-router-dom';
import type { Me } from '../../../shared/api/accounts';

/** The signed-in user, handed down by the shell's outlet to every page inside it. */
export function useSignedInUser(): Me {
  return useOutletContext<Me>();
}
