import { z } from 'zod';

export const siteReportQuerySchema = z.object({ siteId: z.uuid('Choose a site.'), format: z.enum(['csv', 'pdf']).default('pdf') });
export const refrigerantReportQuerySchema = z.object({
  systemId: z.uuid('Choose a system.'),
  year: z.coerce.number().int().min(2000).max(2100),
  format: z.enum(['csv', 'pdf']).default('pdf'),
});
