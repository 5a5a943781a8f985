import { z } from 'zod';
import { optionalText, requiredText } from '@/lib/api/schemas';
import { defineKind } from '@/lib/visits/kinds/types';

// A part fitted. When the whole component was replaced, its record is retired (kept with its
// history) and a new record takes its place, tag and relations included.

export const partDataSchema = z.object({
  part: requiredText('Part', 200),
  quantity: z.number().int().min(1, 'Quantity must be at least 1.').max(1000),
  oldSerial: optionalText(80),
  newSerial: optionalText(80),
  replacesEquipment: z.boolean().default(false),
});
export type PartData = z.infer<typeof partDataSchema>;

export const part = defineKind({
  kind: 'part',
  fits: () => true,
  data: partDataSchema,
  describe: (d) => `Part replaced: ${d.quantity} × ${d.part}${d.oldSerial ? `, old serial ${d.oldSerial}` : ''}${d.newSerial ? `, new serial ${d.newSerial}` : ''}`,
  async apply(d, tools) {
    if (d.replacesEquipment) await tools.replaceComponent(d.newSerial ?? null);
  },
});
