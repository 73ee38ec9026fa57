import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { SignInResponse } from '../../../../shared/api/accounts';
import { afterIdentityChange } from '../../../budget/invalidate';
import { meQuery, tokenQuery } from '../../../budget/queries';

export function useMe() {
  return useQuery(meQuery());
}

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; password: string }) => api<SignInResponse>('/api/auth/login', { method: 'POST', json: body }),
    onSuccess: (r) => afterIdentityChange(qc, r.user),
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>('/api/auth/logout', { method: 'POST' }),
    onSettled: () => afterIdentityChange(qc, null),
  });
}

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
