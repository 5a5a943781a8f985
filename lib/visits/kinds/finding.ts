import { z } from 'zod';
import { optionalText, requiredText } from '@/lib/api/schemas';
import { SEVERITIES, severityLabels } from '@/lib/visits/terms';
import { defineKind } from '@/lib/visits/kinds/types';

// What the technician saw, with its severity; it may raise a follow-up for later work.

export const findingDataSchema = z.object({
  text: requiredText('What was found', 2000),
  severity: z.enum(SEVERITIES, { message: 'Choose a severity.' }),
  raiseFollowUp: z.boolean().default(false),
  followUpTitle: optionalText(200),
});
export type FindingData = z.infer<typeof findingDataSchema>;

export const finding = defineKind({
  kind: 'finding',
  fits: () => true,
  data: findingDataSchema,
  describe: (d) => `Finding (${severityLabels[d.severity] ?? d.severity}): ${d.text}`,
  async apply(d, tools) {
    if (d.raiseFollowUp) await tools.raiseFollowUp({ title: d.followUpTitle ?? d.text.slice(0, 200), severity: d.severity });
  },
});
