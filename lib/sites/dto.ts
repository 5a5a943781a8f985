import type { SiteFlags } from '@/lib/sites/permissions';

/** A site as stored; `SiteDto` adds what the viewer may do there. */
export interface SiteFacts {
  id: string;
  clientId: string;
  clientName: string;
  name: string;
  addressLine1: string | null;
  addressLine2: string | null;
  city: string | null;
  region: string | null;
  postalCode: string | null;
  country: string;
  timeZone: string;
  elevationM: number;
  accessNotes: string | null;
  areaCount: number;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

/** With the viewer's `SiteFlags` (lib/sites/permissions.ts), decided by the service. */
export type SiteDto = SiteFacts & SiteFlags;

export interface AreaDto {
  id: string;
  siteId: string;
  name: string;
  kind: string;
  notes: string | null;
  archivedAt: string | null;
}

export interface SiteRow {
  id: string;
  client_id: string;
  client_name: string;
  name: string;
  address_line1: string | null;
  address_line2: string | null;
  city: string | null;
  region: string | null;
  postal_code: string | null;
  country: string;
  time_zone: string;
  elevation_m: number | string;
  access_notes: string | null;
  area_count: number | string | null;
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

export function toSiteDto(row: SiteRow): SiteFacts {
  return {
    id: row.id,
    clientId: row.client_id,
    clientName: row.client_name,
    name: row.name,
    addressLine1: row.address_line1,
    addressLine2: row.address_line2,
    city: row.city,
    region: row.region,
    postalCode: row.postal_code,
    country: row.country,
    timeZone: row.time_zone,
    elevationM: Number(row.elevation_m),
    accessNotes: row.access_notes,
    areaCount: Number(row.area_count ?? 0),
    archivedAt: row.archived_at?.toISOString() ?? null,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

export function toAreaDto(row: { id: string; site_id: string; name: string; kind: string; notes: string | null; archived_at: Date | null }): AreaDto {
  return { id: row.id, siteId: row.site_id, name: row.name, kind: row.kind, notes: row.notes, archivedAt: row.archived_at?.toISOString() ?? null };
}

export function siteAddress(site: Pick<SiteDto, 'addressLine1' | 'addressLine2' | 'city' | 'region' | 'postalCode'>): string {
  const cityLine = [site.city, [site.region, site.postalCode].filter(Boolean).join(' ')].filter(Boolean).join(', ');
  return [site.addressLine1, site.addressLine2, cityLine].filter(Boolean).join(', ');
}
