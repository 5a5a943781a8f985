import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { updateContactSchema } from '@/lib/clients/schemas';
import { deleteContact, updateContact } from '@/lib/clients/service';

const paramsSchema = z.object({ id: z.uuid(), contactId: z.uuid() });

// PATCH /api/clients/:id/contacts/:contactId: edit a contact.
export const PATCH = withApi({ permission: 'contacts.write', params: paramsSchema, body: updateContactSchema }, async ({ actor, params, body }) =>
  updateContact(actor, params.id, params.contactId, body),
);

// DELETE /api/clients/:id/contacts/:contactId: remove a contact (audited).
export const DELETE = withApi({ params: paramsSchema }, async ({ actor, params }) => deleteContact(actor, params.id, params.contactId));
