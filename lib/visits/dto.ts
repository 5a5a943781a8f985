import type { EntryKind, Severity, VisitReason } from '@/lib/visits/schemas';

export interface VisitDto {
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
  /** For history lists: the visit the entry belongs to. */
  visit?: { reason: VisitReason; startedAt: string; technicianName: string; status: 'open' | 'closed'; timeZone: string };
}

export interface VisitDetailDto extends VisitDto {
  entries: EntryDto[];
  /** Bypasses recorded on this visit and not yet confirmed removed. */
  openBypasses: { entryId: string; description: string }[];
}

export interface FollowUpDto {
  id: string;
  siteId: string;
  siteName: string;
  equipmentId: string | null;
  equipmentName: string | null;
  title: string;
  severity: Severity;
  status: 'open' | 'scheduled' | 'resolved' | 'declined';
  scheduledFor: string | null;
  raisedVisitId: string | null;
  closedVisitId: string | null;
  closedAt: string | null;
  closedByName: string | null;
  resolution: string | null;
  createdAt: string;
  createdByName: string;
  ageDays: number;
}
