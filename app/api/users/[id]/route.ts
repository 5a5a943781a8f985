import { z } from 'zod';
import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { AppError } from '@/lib/errors';
import { changeRoleSchema, setActiveSchema } from '@/lib/users/schemas';
import { changeRole, getUser, setUserActive } from '@/lib/users/service';

const patchSchema = z.union([changeRoleSchema, setActiveSchema]);

// GET /api/users/:id: one user (admin).
export const GET = withApi({ params: idParamsSchema }, async ({ actor, params }) => getUser(actor, params.id));

// PATCH /api/users/:id: change role ({ role, clientId }) or (de)activate ({ active }) (admin).
export const PATCH = withApi({ permission: 'users.manage', params: idParamsSchema, body: patchSchema }, async ({ actor, params, body }) => {
  if ('active' in body) return setUserActive(actor, params.id, body.active);
  if ('role' in body) return changeRole(actor, params.id, body);
  throw new AppError('bad_request');
});
