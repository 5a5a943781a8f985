import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { createContactSchema } from '@/lib/clients/schemas';
import { createContact, listContacts } from '@/lib/clients/service';

// GET /api/clients/:id/contacts: the client's contacts.
export const GET = withApi({ permission: 'contacts.read', params: idParamsSchema }, async ({ actor, params }) => ({ items: await listContacts(actor, params.id), nextCursor: null }));

// POST /api/clients/:id/contacts: add a contact.
export const POST = withApi({ permission: 'contacts.write', params: idParamsSchema, body: createContactSchema, status: 201 }, async ({ actor, params, body }) =>
  createContact(actor, params.id, body),
);
