import { z } from 'zod';
import { optionalText, pageLimit, repeatedParam, requiredText } from '@/lib/api/schemas';
import { labelled } from '@/lib/labelled';

export const { values: URGENCIES, labels: urgencyLabels } = labelled({
  emergency: 'Emergency — product at risk now',
  soon: 'Soon — within a day or two',
  routine: 'Routine — next convenient visit',
});
export type Urgency = (typeof URGENCIES)[number];

export const { values: REQUEST_STATUSES, labels: requestStatusLabels } = labelled({
  new: 'New',
  acknowledged: 'Seen by the office',
  scheduled: 'Visit planned',
  done: 'Done',
  declined: 'Declined',
});
export type RequestStatus = (typeof REQUEST_STATUSES)[number];

export const createRequestSchema = z.object({
  siteId: z.uuid('Choose a site.'),
  equipmentId: z.uuid().nullable().optional(),
  description: requiredText('What is wrong', 2000),
  urgency: z.enum(URGENCIES, { message: 'Choose how urgent it is.' }),
  photoId: z.uuid().nullable().optional(),
});

export const updateRequestSchema = z.object({
  status: z.enum(REQUEST_STATUSES),
  officeNote: optionalText(2000),
  visitId: z.uuid().nullable().optional(),
});

export const listRequestsQuerySchema = z.object({
  siteId: z.uuid().optional(),
  status: repeatedParam(z.enum(REQUEST_STATUSES)),
  limit: pageLimit(200, 100),
});

export type CreateRequestInput = z.infer<typeof createRequestSchema>;
export type UpdateRequestInput = z.infer<typeof updateRequestSchema>;
export type ListRequestsQuery = z.infer<typeof listRequestsQuerySchema>;
