import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '../../../app/http';
import type { Me, SignInResponse, TokenInfo } from '../../../../shared/api/accounts';

/** The signed-in user, or null when signed out (401). */
export const meQuery = () =>
  queryOptions({
    queryKey: ['me'],
    queryFn: async (): Promise<Me | null> => {
      try {
        return await api<Me>('/api/me');
      } catch (e) {
        if (e instanceof ApiError && e.status === 401) return null;
        throw e;
      }
    },
    staleTime: 60_000,
    retry: false,
  });

export function useMe() {
  return useQuery(meQuery());
}

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; password: string }) => api<SignInResponse>('/api/auth/login', { method: 'POST', json: body }),
    onSuccess: (r) => {
      qc.clear();
      qc.setQueryData(meQuery().queryKey, r.user);
    },
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>('/api/auth/logout', { method: 'POST' }),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(meQuery().queryKey, null);
    },
  });
}

/** What a link from an e-mail is for; 404 when it is invalid, used or expired. */
export const tokenQuery = (token: string) =>
  queryOptions({
    queryKey: ['auth', 'token', token],
    queryFn: () => api<TokenInfo>(`/api/auth/token?token=${encodeURIComponent(token)}`),
    retry: false,
    staleTime: Infinity,
  });

export function useToken(token: string) {
  return useQuery({ ...tokenQuery(token), enabled: token.length >= 10 });
}

export function useRequestReset() {
  return useMutation({
    mutationFn: (email: string) => api<{ message: string }>('/api/auth/password-reset', { method: 'POST', json: { email } }),
  });
}

export function useCompleteToken() {
  return useMutation({
    mutationFn: (body: { token: string; password: string }) => api<SignInResponse>('/api/auth/password-reset/complete', { method: 'POST', json: body }),
  });
}
