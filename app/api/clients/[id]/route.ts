import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { updateClientSchema } from '@/lib/clients/schemas';
import { getClient, updateClient } from '@/lib/clients/service';

// GET /api/clients/:id: one client.
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getClient(actor, params.id));

// PATCH /api/clients/:id: edit a client.
export const PATCH = withApi({ permission: 'clients.write', params: idParamsSchema, body: updateClientSchema }, async ({ actor, params, body }) =>
  updateClient(actor, params.id, body),
);
