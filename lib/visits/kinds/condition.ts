import { z } from 'zod';
import { optionalText } from '@/lib/api/schemas';
import { defineKind } from '@/lib/visits/kinds/types';

// The unit's condition, 1 (failing) to 5 (like new); the unit's record follows it.

export const conditionDataSchema = z.object({
  rating: z.number().int().min(1, 'Rate from 1 (failing) to 5 (like new).').max(5, 'Rate from 1 (failing) to 5 (like new).'),
  note: optionalText(1000),
});
export type ConditionData = z.infer<typeof conditionDataSchema>;

export const condition = defineKind({
  kind: 'condition',
  fits: () => true,
  data: conditionDataSchema,
  describe: (d) => `Condition rated ${d.rating} of 5${d.note ? `: ${d.note}` : ''}`,
  apply: (d, tools) => tools.setCondition(d.rating, d.note ?? null),
});
