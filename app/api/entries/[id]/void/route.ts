import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { voidEntrySchema } from '@/lib/visits/schemas';
import { voidEntry } from '@/lib/visits/entries';

// POST /api/entries/:id/void: void a wrong entry with a reason (kept and audited, never deleted).
export const POST = withApi({ permission: 'entries.write', params: idParamsSchema, body: voidEntrySchema }, async ({ actor, params, body }) =>
  voidEntry(actor, params.id, body.reason),
);
