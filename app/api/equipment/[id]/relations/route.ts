import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { createRelationSchema } from '@/lib/equipment/schemas';
import { addRelation, getEquipment } from '@/lib/equipment/service';

// GET /api/equipment/:id/relations: what this equipment controls or serves, and what controls or serves it.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => ({ items: (await getEquipment(actor, params.id)).relations, nextCursor: null }));

// POST /api/equipment/:id/relations: relate it to other equipment on the same site.
export const POST = withApi({ permission: 'equipment.write', params: idParamsSchema, body: createRelationSchema, status: 201 }, async ({ actor, params, body }) => ({
  items: await addRelation(actor, params.id, body),
  nextCursor: null,
}));
