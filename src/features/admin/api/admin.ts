import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { InvitationResponse, MailMessage, UserAccount } from '../../../../shared/api/accounts';
import type { Role } from '../../../../shared/policy/policy';

export const usersQuery = () => queryOptions({ queryKey: ['users'], queryFn: () => api<UserAccount[]>('/api/users') });
export const mailQuery = () => queryOptions({ queryKey: ['mail'], queryFn: () => api<MailMessage[]>('/api/dev/mail?limit=200'), refetchInterval: 10_000 });

export function useUsers() {
  return useQuery(usersQuery());
}

export function useMail() {
  return useQuery(mailQuery());
}

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...patch }: { id: number; role?: Role; active?: boolean; name?: string; reason?: string }) => api<UserAccount>(`/api/users/${id}`, { method: 'PATCH', json: patch }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['users'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

export function useInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; name: string; role: Role }) => api<InvitationResponse>('/api/invitations', { method: 'POST', json: body }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['users'] });
      qc.invalidateQueries({ queryKey: ['mail'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}
