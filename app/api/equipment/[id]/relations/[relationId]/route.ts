import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { removeRelation } from '@/lib/equipment/service';

const paramsSchema = z.object({ id: z.uuid(), relationId: z.uuid() });

// DELETE /api/equipment/:id/relations/:relationId: remove a relation (audited).
export const DELETE = withApi({ permission: 'equipment.write', params: paramsSchema }, async ({ actor, params }) => removeRelation(actor, params.id, params.relationId));
