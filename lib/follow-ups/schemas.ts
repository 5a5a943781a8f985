import { z } from 'zod';
import { optionalText, pageParams, repeatedParam, requiredText } from '@/lib/api/schemas';
import { labelled } from '@/lib/labelled';
import { SEVERITIES } from '@/lib/visits/schemas';

export const { values: FOLLOW_UP_STATUSES, labels: followUpStatusLabels } = labelled({ open: 'Open', scheduled: 'Scheduled', resolved: 'Resolved', declined: 'Declined' });
export type FollowUpStatus = (typeof FOLLOW_UP_STATUSES)[number];

export const listFollowUpsQuerySchema = z.object({
  siteId: z.uuid().optional(),
  equipmentId: z.uuid().optional(),
  status: repeatedParam(z.enum(FOLLOW_UP_STATUSES)),
  severity: repeatedParam(z.enum(SEVERITIES)),
  ...pageParams(200, 50),
});

export const createFollowUpSchema = z.object({
  siteId: z.uuid(),
  equipmentId: z.uuid().nullable().optional(),
  title: requiredText('Title', 200),
  severity: z.enum(SEVERITIES, { message: 'Choose a severity.' }),
});

/** Open → scheduled → resolved or declined; resolved and declined are final. */
export const updateFollowUpSchema = z.discriminatedUnion('status', [
  z.object({ status: z.literal('scheduled'), scheduledFor: z.iso.date('Choose the date it is planned for.') }),
  z.object({ status: z.literal('resolved'), resolution: requiredText('What was done', 2000), visitId: z.uuid().nullable().optional() }),
  z.object({ status: z.literal('declined'), resolution: requiredText('Why it was declined', 2000), visitId: z.uuid().nullable().optional() }),
  z.object({ status: z.literal('open'), resolution: optionalText(2000) }),
]);

export type ListFollowUpsQuery = z.infer<typeof listFollowUpsQuerySchema>;
export type CreateFollowUpInput = z.infer<typeof createFollowUpSchema>;
export type UpdateFollowUpInput = z.infer<typeof updateFollowUpSchema>;
