import type { PlanStatus } from '@/lib/plans/terms';
import type { VisitReason } from '@/lib/visits/terms';

export interface PlanDto {
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
  visitId: string | null;
  cancelReason: string | null;
  systems: { id: string; name: string }[];
  equipment: { id: string; name: string }[];
  /** The viewer may move or cancel it (the office, while it is planned). */
  canChange: boolean;
  /** The viewer may start a visit from it (staff, while it is planned). */
  canStart: boolean;
  updatedAt: string;
}
