'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import type { ClientDto, ContactDto } from '@/lib/clients/dto';
import type { CreateClientInput, CreateContactInput, UpdateClientInput } from '@/lib/clients/schemas';

export const clientKeys = {
  all: ['clients'] as const,
  list: (q: Record<string, unknown>) => ['clients', 'list', q] as const,
  detail: (id: string) => ['clients', 'detail', id] as const,
};

export function useSaveClient(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateClientInput | UpdateClientInput) =>
      id ? apiFetch<ClientDto>(`/api/clients/${id}`, { method: 'PATCH', json: input }) : apiFetch<ClientDto>('/api/clients', { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clientKeys.all }),
  });
}

export function useArchiveClient(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (archived: boolean) => apiFetch<ClientDto>(`/api/clients/${id}/${archived ? 'archive' : 'restore'}`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clientKeys.all }),
  });
}

export function useSaveContact(clientId: string, contactId?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateContactInput) =>
      contactId
        ? apiFetch<ContactDto>(`/api/clients/${clientId}/contacts/${contactId}`, { method: 'PATCH', json: input })
        : apiFetch<ContactDto>(`/api/clients/${clientId}/contacts`, { method: 'POST', json: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clientKeys.detail(clientId) }),
  });
}

export function useDeleteContact(clientId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (contactId: string) => apiFetch<void>(`/api/clients/${clientId}/contacts/${contactId}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clientKeys.detail(clientId) }),
  });
}
