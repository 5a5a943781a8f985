import type { SystemFlags } from '@/lib/systems/permissions';

export interface SystemFacts {
  id: string;
  siteId: string;
  siteName: string;
  areaId: string | null;
  areaName: string | null;
  name: string;
  refrigerant: string;
  fullChargeKg: number | null;
  application: 'commercial_refrigeration' | 'industrial_process' | 'comfort_cooling';
  designBoxTempC: number | null;
  maintenanceIntervalDays: number | null;
  notes: string | null;
  equipmentCount: number;
  /** The system's condensing unit (or compressor rack), when one is registered. */
  condensingUnit: { id: string; name: string } | null;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

/** With the viewer's `SystemFlags` (lib/systems/permissions.ts), decided by the service. */
export type SystemDto = SystemFacts & SystemFlags;
