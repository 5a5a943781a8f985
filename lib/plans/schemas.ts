import { z } from 'zod';
import { optionalText, pageLimit, repeatedParam } from '@/lib/api/schemas';
import { PLAN_STATUSES } from '@/lib/plans/terms';
import { VISIT_REASONS } from '@/lib/visits/terms';

// Request shapes of planned visits, shared by the forms, the routes and the service.

const day = (message: string) => z.iso.date(message);
const clock = (message: string) => z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, message);

const when = {
  technicianId: z.uuid('Choose a technician.'),
  day: day('Choose the day.'),
  windowStart: clock('Give a start time like 08:00.'),
  windowEnd: clock('Give an end time like 10:00.'),
};

const windowInOrder = (v: { windowStart: string; windowEnd: string }) => v.windowEnd > v.windowStart;
const windowMessage = { path: ['windowEnd'], message: 'The window must end after it starts.' };

export const createPlanSchema = z
  .object({
    siteId: z.uuid('Choose a site.'),
    systemIds: z.array(z.uuid('Choose a system from the list.')).max(50, 'Choose at most 50 systems.').default([]),
    equipmentIds: z.array(z.uuid('Choose a unit from the list.')).max(100, 'Choose at most 100 units.').default([]),
    reason: z.enum(VISIT_REASONS, { message: 'Choose the reason for the visit.' }),
    ...when,
    note: optionalText(1000),
  })
  .refine(windowInOrder, windowMessage);

/** Moving a plan: another day, window or technician. */
export const movePlanSchema = z.object(when).refine(windowInOrder, windowMessage);

export const cancelPlanSchema = z.object({ reason: optionalText(500) });

export const listPlansQuerySchema = z.object({
  from: day('Use a day as YYYY-MM-DD.').optional(),
  to: day('Use a day as YYYY-MM-DD.').optional(),
  siteId: z.uuid().optional(),
  technicianId: z.uuid().optional(),
  status: repeatedParam(z.enum(PLAN_STATUSES)),
  limit: pageLimit(500, 200),
});

export type CreatePlanInput = z.infer<typeof createPlanSchema>;
export type MovePlanInput = z.infer<typeof movePlanSchema>;
export type CancelPlanInput = z.infer<typeof cancelPlanSchema>;
export type ListPlansQuery = z.infer<typeof listPlansQuerySchema>;
