import { can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';

// What the viewer may do at a site, decided once and sent with the site (page and API alike).
// An archived site keeps its history but takes no new work.

export interface SiteFlags {
  canEdit: boolean;
  canManageAreas: boolean;
  canStartVisit: boolean;
  /** The owner's "ask for service" (the office records requests from the request list). */
  canAskForService: boolean;
  /** Keep the site on the phone for work without signal. */
  canKeepOffline: boolean;
  canPlan: boolean;
  canManageSystems: boolean;
  canRegisterEquipment: boolean;
  canImportEquipment: boolean;
}

export function siteFlags(actor: Actor, site: { archivedAt: string | null }): SiteFlags {
  const live = !site.archivedAt;
  return {
    canEdit: can(actor, 'sites.write'),
    canManageAreas: can(actor, 'areas.write'),
    canStartVisit: live && can(actor, 'visits.start'),
    canAskForService: live && actor.role === 'client' && can(actor, 'requests.create'),
    canKeepOffline: live && can(actor, 'entries.write'),
    canPlan: live && can(actor, 'plans.write'),
    canManageSystems: live && can(actor, 'systems.write'),
    canRegisterEquipment: live && can(actor, 'equipment.write'),
    canImportEquipment: live && can(actor, 'equipment.import'),
  };
}
