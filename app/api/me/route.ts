import { withApi } from '@/lib/api/handler';
import { updateProfileSchema } from '@/lib/users/schemas';
import { updateProfile } from '@/lib/users/service';

// GET /api/me: the signed-in user.
export const GET = withApi({}, async ({ actor }) => actor);

// PATCH /api/me: own name and unit preferences.
export const PATCH = withApi({ body: updateProfileSchema }, async ({ actor, body }) => updateProfile(actor, body));
