import { can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import type { PlanStatus } from '@/lib/plans/terms';

// What the viewer may do with planned visits, decided once and sent with them (pages and
// /api/plans alike); the plan service enforces the same.

export interface PlanFlags {
  /** The viewer may move or cancel it (the office, while it is planned). */
  canChange: boolean;
  /** The viewer may start a visit from it now: the technician it names, from its day on, while it is planned. */
  canStart: boolean;
}

export function planFlags(actor: Actor, plan: { status: PlanStatus; technicianId: string; day: string }, siteToday: string): PlanFlags {
  const planned = plan.status === 'planned';
  return {
    canChange: planned && can(actor, 'plans.write'),
    canStart: planned && can(actor, 'visits.start') && plan.technicianId === actor.id && plan.day <= siteToday,
  };
}

/** What a list of plans lets the viewer do besides: plan a new visit. */
export interface PlanListFlags {
  canCreate: boolean;
}

export function planListFlags(actor: Actor): PlanListFlags {
  return { canCreate: can(actor, 'plans.write') };
}
