import { z } from 'zod';
import { optionalText, requiredText } from '@/lib/api/schemas';
import { defineKind } from '@/lib/visits/kinds/types';

// What was done. A jumper or bypass across a safety or operating control is recorded here, for
// diagnosis only; the visit cannot close until its removal is confirmed.

export const actionDataSchema = z
  .object({
    text: requiredText('What was done', 2000),
    bypassedControl: z.boolean().default(false),
    bypassDescription: optionalText(300),
  })
  .refine((d) => !d.bypassedControl || Boolean(d.bypassDescription), { message: 'Say which control was bypassed.', path: ['bypassDescription'] });
export type ActionData = z.infer<typeof actionDataSchema>;

export const action = defineKind({
  kind: 'action',
  fits: () => true,
  data: actionDataSchema,
  describe: (d) => `Action: ${d.text}${d.bypassedControl ? ` (temporary bypass: ${d.bypassDescription})` : ''}`,
});
