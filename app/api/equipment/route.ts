import { withApi } from '@/lib/api/handler';
import { createEquipmentSchema, listEquipmentQuerySchema } from '@/lib/equipment/schemas';
import { createEquipment, listEquipment } from '@/lib/equipment/service';

// GET /api/equipment: equipment visible to the caller (filters, search q, sort, keyset pages).
export const GET = withApi({ query: listEquipmentQuerySchema }, async ({ actor, query }) => listEquipment(actor, query));

// POST /api/equipment: register a piece of equipment (type-specific nameplate).
export const POST = withApi({ permission: 'equipment.write', body: createEquipmentSchema, status: 201 }, async ({ actor, body }) => createEquipment(actor, body));
