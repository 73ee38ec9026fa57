import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { InvitationResponse, UserAccount } from '../../../../shared/api/accounts';
import type { InviteInput, UserPatch, UserSort } from '../../../../shared/api/user-admin';
import { afterAccountChange } from '../../../budget/invalidate';
import { mailQuery, usersPageQuery } from '../../../budget/queries';
import type { PageRequest, UserFilter } from '../../../budget/query-keys';

export function useUsers(filter: UserFilter, page: PageRequest<UserSort>) {
  return useQuery(usersPageQuery(filter, page));
}

export function useMail() {
  return useQuery(mailQuery());
}

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...patch }: UserPatch & { id: number }) => api<UserAccount>(`/api/users/${id}`, { method: 'PATCH', json: patch }),
    onSuccess: () => afterAccountChange(qc),
  });
}

export function useInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteInput) => api<InvitationResponse>('/api/invitations', { method: 'POST', json: body }),
    onSuccess: () => afterAccountChange(qc),
  });
}
