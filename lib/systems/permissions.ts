import { can } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';

// What the viewer may do on a refrigeration system, decided once and sent with it (page and
// GET /api/systems/:id alike). An archived system keeps its units and history but takes no new
// unit or plan; the office may still edit or restore it.

export interface SystemFlags {
  canEdit: boolean;
  /** Archive, or restore an archived one. */
  canArchive: boolean;
  canRegisterEquipment: boolean;
  canPlan: boolean;
}

export function systemFlags(actor: Actor, system: { archivedAt: string | null }): SystemFlags {
  const live = !system.archivedAt;
  return {
    canEdit: can(actor, 'systems.write'),
    canArchive: can(actor, 'systems.write'),
    canRegisterEquipment: live && can(actor, 'equipment.write'),
    canPlan: live && can(actor, 'plans.write'),
  };
}
