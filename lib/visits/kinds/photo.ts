import { z } from 'zod';
import { optionalText } from '@/lib/api/schemas';
import { defineKind, EntryRefusal } from '@/lib/visits/kinds/types';

// A photo of the unit, uploaded first (lib/photos) and then linked to the visit by this entry.

export const photoDataSchema = z.object({ photoId: z.uuid(), caption: optionalText(300) });
export type PhotoData = z.infer<typeof photoDataSchema>;

export const photo = defineKind({
  kind: 'photo',
  fits: () => true,
  data: photoDataSchema,
  describe: (d) => `Photo${d.caption ? `: ${d.caption}` : ''}`,
  async compute(d, tools) {
    if (!(await tools.photoOnUnit(d.photoId))) throw new EntryRefusal('That photo does not belong to this equipment.', 'data.photoId', 'Upload the photo on this unit first.');
    return null;
  },
});
