import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { Role } from '../../../../shared/policy/policy';

export interface User {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  /** False until an invited user sets a password. */
  hasPassword: boolean;
  createdAt: number;
}

export interface MailMessage {
  id: number;
  at: number;
  sender: string;
  recipients: string[];
  subject: string;
  text: string;
}

export const usersQuery = () => queryOptions({ queryKey: ['users'], queryFn: () => api<User[]>('/api/users') });
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
    mutationFn: ({ id, ...patch }: { id: number; role?: Role; active?: boolean; name?: string }) => api<User>(`/api/users/${id}`, { method: 'PATCH', json: patch }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['users'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

export function useInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; name: string; role: Role }) => api<{ user: User; expiresAt: number }>('/api/invitations', { method: 'POST', json: body }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['users'] });
      qc.invalidateQueries({ queryKey: ['mail'] });
      qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}
