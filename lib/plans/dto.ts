import type { Page } from '@/lib/api/cursor';
import type { PlanFlags, PlanListFlags } from '@/lib/plans/permissions';
import type { PlanStatus } from '@/lib/plans/terms';
import type { VisitReason } from '@/lib/visits/terms';

/** A planned visit with what the viewer may do on it (`PlanFlags`, lib/plans/permissions.ts). */
export interface PlanDto extends PlanFlags {
  id: string;
  siteId: string;
  siteName: string;
  clientName: string;
  /** The site's time zone: the day and window are its local calendar and clock. */
  timeZone: string;
  reason: VisitReason;
  technicianId: string;
  technicianName: string;
  day: string;
  windowStart: string;
  windowEnd: string;
  status: PlanStatus;
  /** Not started and its day has passed on the site's calendar. */
  overdue: boolean;
  /** The site's today, so pages can say "today" without their own clock. */
  siteToday: string;
  note: string | null;
  /** The visit it started, when the viewer may open it (an owner: once it is closed). */
  visitId: string | null;
  cancelReason: string | null;
  systems: { id: string; name: string }[];
  equipment: { id: string; name: string }[];
  updatedAt: string;
}

export type PlanPage = Page<PlanDto> & PlanListFlags;
