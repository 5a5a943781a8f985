import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { updateEquipmentSchema } from '@/lib/equipment/schemas';
import { deleteEquipment, getEquipment, updateEquipment } from '@/lib/equipment/service';

// GET /api/equipment/:id: one piece of equipment with its relations.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getEquipment(actor, params.id));

// PATCH /api/equipment/:id: edit common and nameplate fields.
export const PATCH = withApi({ permission: 'equipment.write', params: idParamsSchema, body: updateEquipmentSchema }, async ({ actor, params, body }) =>
  updateEquipment(actor, params.id, body),
);

// DELETE /api/equipment/:id: soft delete (kept for its history; audited).
export const DELETE = withApi({ permission: 'equipment.delete', params: idParamsSchema }, async ({ actor, params }) => deleteEquipment(actor, params.id));
