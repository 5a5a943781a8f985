'use client';

import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { CompanyDto, InvitationDto, UserDto } from '@/lib/users/dto';
import type { ChangeRoleInput, InviteUserInput, UpdateCompanyInput, UpdateProfileInput } from '@/lib/users/schemas';

export const userKeys = { all: ['users'] as const, invitations: ['invitations'] as const };

export function useInvite() {
  return useMutation({ mutationFn: (input: InviteUserInput) => apiFetch<InvitationDto>('/api/invitations', { method: 'POST', json: input }) });
}

export function useRevokeInvitation() {
  return useMutation({ mutationFn: (id: string) => apiFetch<void>(`/api/invitations/${id}`, { method: 'DELETE' }) });
}

export function useChangeRole(userId: string) {
  return useMutation({ mutationFn: (input: ChangeRoleInput) => apiFetch<UserDto>(`/api/users/${userId}`, { method: 'PATCH', json: input }) });
}

export function useSetActive(userId: string) {
  return useMutation({ mutationFn: (active: boolean) => apiFetch<UserDto>(`/api/users/${userId}`, { method: 'PATCH', json: { active } }) });
}

export function useUpdateProfile() {
  return useMutation({ mutationFn: (input: UpdateProfileInput) => apiFetch('/api/me', { method: 'PATCH', json: input }) });
}

export function useUpdateCompany() {
  return useMutation({ mutationFn: (input: UpdateCompanyInput) => apiFetch<CompanyDto>('/api/company', { method: 'PATCH', json: input }) });
}
