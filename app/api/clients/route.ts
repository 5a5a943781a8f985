import { withApi } from '@/lib/api/handler';
import { createClientSchema, listClientsQuerySchema } from '@/lib/clients/schemas';
import { createClient, listClients } from '@/lib/clients/service';

// GET /api/clients: clients visible to the caller (keyset pages).
export const GET = withApi({ query: listClientsQuerySchema }, async ({ actor, query }) => listClients(actor, query));

// POST /api/clients: create a client.
export const POST = withApi({ permission: 'clients.write', body: createClientSchema, status: 201 }, async ({ actor, body }) => createClient(actor, body));
