import { z } from 'zod';
import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { createAreaSchema } from '@/lib/sites/schemas';
import { createArea, listAreas } from '@/lib/sites/service';

const querySchema = z.object({ archived: z.enum(['include', 'exclude']).default('exclude') });

// GET /api/sites/:id/areas: the site's areas.
export const GET = withApi({ params: idParamsSchema, query: querySchema }, async ({ actor, params, query }) => ({
  items: await listAreas(actor, params.id, query.archived === 'include'),
  nextCursor: null,
}));

// POST /api/sites/:id/areas: add an area.
export const POST = withApi({ permission: 'areas.write', params: idParamsSchema, body: createAreaSchema, status: 201 }, async ({ actor, params, body }) =>
  createArea(actor, params.id, body),
);
