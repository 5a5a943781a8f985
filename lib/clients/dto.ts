import type { ClientFlags } from '@/lib/clients/permissions';

export interface ClientFacts {
  id: string;
  name: string;
  notes: string | null;
  siteCount: number;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

/** With the viewer's `ClientFlags` (lib/clients/permissions.ts), decided by the service. */
export type ClientDto = ClientFacts & ClientFlags;

export interface ContactDto {
  id: string;
  clientId: string;
  name: string;
  email: string | null;
  phone: string | null;
  title: string | null;
  receivesReports: boolean;
}

export function toClientFacts(row: {
  id: string;
  name: string;
  notes: string | null;
  site_count: number | string | null;
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
}): ClientFacts {
  return {
    id: row.id,
    name: row.name,
    notes: row.notes,
    siteCount: Number(row.site_count ?? 0),
    archivedAt: row.archived_at?.toISOString() ?? null,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

export function toContactDto(row: {
  id: string;
  client_id: string;
  name: string;
  email: string | null;
  phone: string | null;
  title: string | null;
  receives_reports: boolean;
}): ContactDto {
  return {
    id: row.id,
    clientId: row.client_id,
    name: row.name,
    email: row.email,
    phone: row.phone,
    title: row.title,
    receivesReports: row.receives_reports,
  };
}
