import { z } from 'zod';
import { requiredText } from '@/lib/api/schemas';
import { passwordSchema } from '@/lib/auth/schemas';
import { roles } from '@/lib/auth/permissions';

const email = z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.'));

export const inviteUserSchema = z
  .object({
    email,
    name: requiredText('Name', 120),
    role: z.enum(roles, { message: 'Choose a role.' }),
    clientId: z.uuid().nullable().optional(),
  })
  .refine((v) => (v.role === 'client') === Boolean(v.clientId), {
    message: 'An owner must belong to exactly one client; other roles belong to none.',
    path: ['clientId'],
  });

export const changeRoleSchema = z
  .object({ role: z.enum(roles), clientId: z.uuid().nullable().optional() })
  .refine((v) => (v.role === 'client') === Boolean(v.clientId), {
    message: 'An owner must belong to exactly one client; other roles belong to none.',
    path: ['clientId'],
  });

export const setActiveSchema = z.object({ active: z.boolean() });

export const acceptInvitationSchema = z
  .object({ token: z.string().min(20).max(200), password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ.', path: ['confirm'] });

export const updateProfileSchema = z.object({
  name: requiredText('Name', 120).optional(),
  units: z.enum(['imperial', 'metric']).optional(),
  metricPressure: z.enum(['kPa', 'bar']).optional(),
});

export const updateCompanySchema = z.object({
  name: requiredText('Company name', 120).optional(),
  servicePhone: z.string().trim().max(40).nullable().optional(),
  labelLine: z.string().trim().max(60, 'Keep the label line to 60 characters so it fits small labels.').nullable().optional(),
  defaultUnits: z.enum(['imperial', 'metric']).optional(),
  keepPhotoLocation: z.boolean().optional(),
  /** E-mail the client's contacts when a visit is planned, moved or cancelled. */
  mailVisitPlans: z.boolean().optional(),
});

export type InviteUserInput = z.infer<typeof inviteUserSchema>;
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
export type UpdateProfileInput = z.infer<typeof updateProfileSchema>;
export type UpdateCompanyInput = z.infer<typeof updateCompanySchema>;
