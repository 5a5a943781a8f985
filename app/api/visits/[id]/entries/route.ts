import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { createEntrySchema } from '@/lib/visits/schemas';
import { addEntry } from '@/lib/visits/entries';

// POST /api/visits/:id/entries: save one entry as it is made (idempotent by clientEntryId).
export const POST = withApi({ permission: 'entries.write', params: idParamsSchema, body: createEntrySchema, status: 201 }, async ({ actor, params, body }) =>
  addEntry(actor, params.id, body),
);
