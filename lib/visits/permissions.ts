import { can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';

// Who may do what on a visit, decided once: the services enforce these and send them as flags
// with the data, so pages and components read the flags and never re-derive them from the role.

/** The visit's technician works on it; office and admin may add to any open one. */
export function mayWorkOnVisit(actor: Actor, visit: { technicianId: string }): boolean {
  return can(actor, 'entries.write') && (visit.technicianId === actor.id || can(actor, 'visits.review'));
}

/** An entry is struck out by its author or by the office. */
export function mayVoidEntryOf(actor: Actor, entry: { createdBy: string }): boolean {
  return can(actor, 'entries.write') && (entry.createdBy === actor.id || can(actor, 'visits.review'));
}

export interface VisitFlags {
  /** Entries may be added (the visit is open and the viewer works on it). */
  canAddEntries: boolean;
  canClose: boolean;
  /** Closed and not yet marked reviewed, and the viewer is office or admin. */
  canReview: boolean;
  canReopen: boolean;
}

export function visitFlags(actor: Actor, visit: { status: 'open' | 'closed'; technicianId: string; reviewedAt: string | null }): VisitFlags {
  const works = visit.status === 'open' && mayWorkOnVisit(actor, visit);
  const office = visit.status === 'closed' && can(actor, 'visits.review');
  return {
    canAddEntries: works,
    canClose: works && can(actor, 'visits.start'),
    canReview: office && !visit.reviewedAt,
    canReopen: office,
  };
}

/** Once the office has reviewed a closed visit (its report went out), its entries stay as they are until a reopen. */
export function entryCanVoid(actor: Actor, visit: { status: 'open' | 'closed'; reviewedAt: string | null }, entry: { createdBy: string; voidedAt: string | null }): boolean {
  if (entry.voidedAt) return false;
  if (visit.status === 'closed' && visit.reviewedAt) return false;
  return mayVoidEntryOf(actor, entry);
}
