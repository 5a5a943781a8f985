import { withApi } from '@/lib/api/handler';
import { inviteUserSchema } from '@/lib/users/schemas';
import { inviteUser, listInvitations } from '@/lib/users/service';

// GET /api/invitations: open invitations (admin).
export const GET = withApi({}, async ({ actor }) => ({ items: await listInvitations(actor), nextCursor: null }));

// POST /api/invitations: invite someone by e-mail (admin).
export const POST = withApi({ permission: 'users.manage', body: inviteUserSchema, status: 201 }, async ({ actor, body }) => inviteUser(actor, body));
