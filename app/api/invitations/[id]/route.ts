import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { revokeInvitation } from '@/lib/users/service';

// DELETE /api/invitations/:id: revoke an open invitation (admin).
export const DELETE = withApi({ params: idParamsSchema }, async ({ actor, params }) => revokeInvitation(actor, params.id));
