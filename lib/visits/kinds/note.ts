import { z } from 'zod';
import { requiredText } from '@/lib/api/schemas';
import { defineKind } from '@/lib/visits/kinds/types';

export const noteDataSchema = z.object({ text: requiredText('Note', 4000) });
export type NoteData = z.infer<typeof noteDataSchema>;

export const note = defineKind({
  kind: 'note',
  fits: () => true,
  data: noteDataSchema,
  describe: (d) => `Note: ${d.text}`,
});
