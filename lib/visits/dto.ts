import type { VisitFlags } from '@/lib/visits/permissions';
import type { EntryKind, VisitReason } from '@/lib/visits/schemas';

/** With what the viewer may do on it (`VisitFlags`, lib/visits/permissions.ts), decided by the service. */
export interface VisitDto extends VisitFlags {
  id: string;
  siteId: string;
  siteName: string;
  clientName: string;
  timeZone: string;
  technicianId: string;
  technicianName: string;
  reason: VisitReason;
  status: 'open' | 'closed';
  startedAt: string;
  endedAt: string | null;
  summary: string | null;
  reviewedAt: string | null;
  reopenedAt: string | null;
  hasReport: boolean;
  entryCount: number;
}

export interface EntryDto {
  id: string;
  visitId: string;
  equipmentId: string;
  equipmentName: string;
  equipmentType: string;
  kind: EntryKind;
  data: Record<string, unknown>;
  computed: Record<string, unknown> | null;
  recordedAt: string;
  createdBy: string;
  createdByName: string;
  voidedAt: string | null;
  voidReason: string | null;
  /** Made on the phone when the entry was submitted; a retry with it returns the first save. */
  clientEntryId: string;
  /** The viewer may strike it out (lib/visits/permissions.ts `entryCanVoid`). */
  canVoid: boolean;
  /** For history lists: the visit the entry belongs to. */
  visit?: { reason: VisitReason; startedAt: string; technicianName: string; status: 'open' | 'closed'; timeZone: string };
}

export interface VisitDetailDto extends VisitDto {
  entries: EntryDto[];
  /** Bypasses recorded on this visit and not yet confirmed removed. */
  openBypasses: { entryId: string; description: string }[];
}
