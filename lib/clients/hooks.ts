'use client';

import { apiFetch } from '@/lib/api/client';
import { archiveRecord, saveRecord, useChange } from '@/lib/mutations';
import type { ClientDto, ContactDto } from '@/lib/clients/dto';
import type { CreateClientInput, CreateContactInput, UpdateClientInput } from '@/lib/clients/schemas';

export const clientKeys = {
  all: ['clients'] as const,
  list: (q: Record<string, unknown>) => ['clients', 'list', q] as const,
  detail: (id: string) => ['clients', 'detail', id] as const,
};

export function useSaveClient(id?: string) {
  return useChange((input: CreateClientInput | UpdateClientInput) => saveRecord<ClientDto>('/api/clients', id, input), clientKeys.all);
}

export function useArchiveClient(id: string) {
  return useChange((archived: boolean) => archiveRecord<ClientDto>(`/api/clients/${id}`, archived), clientKeys.all);
}

export function useSaveContact(clientId: string, contactId?: string) {
  return useChange((input: CreateContactInput) => saveRecord<ContactDto>(`/api/clients/${clientId}/contacts`, contactId, input), clientKeys.detail(clientId));
}

export function useDeleteContact(clientId: string) {
  return useChange((contactId: string) => apiFetch<void>(`/api/clients/${clientId}/contacts/${contactId}`, { method: 'DELETE' }), clientKeys.detail(clientId));
}
