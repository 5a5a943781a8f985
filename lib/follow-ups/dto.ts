import type { FollowUpStatus } from '@/lib/follow-ups/schemas';
import type { Severity } from '@/lib/visits/schemas';

export interface FollowUpDto {
  id: string;
  siteId: string;
  siteName: string;
  equipmentId: string | null;
  equipmentName: string | null;
  title: string;
  severity: Severity;
  status: FollowUpStatus;
  scheduledFor: string | null;
  raisedVisitId: string | null;
  closedVisitId: string | null;
  closedAt: string | null;
  closedByName: string | null;
  resolution: string | null;
  createdAt: string;
  createdByName: string;
  ageDays: number;
  /** The viewer may move it on (schedule, resolve, decline, back to open): decided by the service. */
  canUpdate: boolean;
}
