import { can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import type { EquipmentStatus } from '@/lib/equipment/types';

// What the viewer may do on a unit, decided once from the access matrix and sent with the unit
// (page and GET /api/equipment/:id alike). A removed unit keeps its history and may still be
// edited (to bring it back), but takes no new work, tag or connection.

export interface EquipmentFlags {
  canEdit: boolean;
  canDelete: boolean;
  /** Add or remove connections to other units (controls, serves). */
  canEditRelations: boolean;
  /** Log a visit here, or continue the viewer's open one at the site. */
  canStartVisit: boolean;
  canUploadPhoto: boolean;
  /** The owner's "ask for service" from the unit. */
  canAskForService: boolean;
  /** The office records a request for the unit (from its "more" menu). */
  canLogRequest: boolean;
  /** Put a tag on the unit or replace its tag. */
  canAttachTag: boolean;
  canPrintTag: boolean;
}

export function equipmentFlags(actor: Actor, equipment: { status: EquipmentStatus }): EquipmentFlags {
  const live = equipment.status !== 'removed';
  const requests = live && can(actor, 'requests.create');
  return {
    canEdit: can(actor, 'equipment.write'),
    canDelete: can(actor, 'equipment.delete'),
    canEditRelations: live && can(actor, 'equipment.write'),
    canStartVisit: live && can(actor, 'visits.start'),
    canUploadPhoto: can(actor, 'photos.upload'),
    canAskForService: requests && actor.role === 'client',
    canLogRequest: requests && actor.role !== 'client',
    canAttachTag: live && can(actor, 'tags.claim'),
    canPrintTag: live && can(actor, 'tags.claim') && can(actor, 'tags.print'),
  };
}
