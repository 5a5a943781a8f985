import { z } from 'zod';
import { listQueryBase, optionalText } from '@/lib/api/schemas';
import { labelled } from '@/lib/labelled';
import { parseCode } from '@/lib/tags/code';

export const { values: TAG_STATES, labels: tagStateLabels } = labelled({ blank: 'Blank', attached: 'Attached', retired: 'Retired' });
export type TagState = (typeof TAG_STATES)[number];

export const { values: RETIRE_REASONS, labels: retireReasonLabels } = labelled({
  replaced: 'Replaced by a new tag',
  damaged: 'Damaged or unreadable',
  lost: 'Lost or removed from the unit',
  unused: 'Never used (voided)',
});
export type RetireReason = (typeof RETIRE_REASONS)[number];

export const SCAN_VIA = ['link', 'camera', 'typed'] as const;
export type ScanVia = (typeof SCAN_VIA)[number];

/** A tag code in any accepted spelling (lower case, hyphens, O for 0); parses to the canonical code. */
export const tagCodeSchema = z
  .string()
  .max(40)
  .transform((v, ctx) => {
    const code = parseCode(v);
    if (!code) {
      ctx.addIssue({ code: 'custom', message: 'This is not a valid tag code: check the characters.' });
      return z.NEVER;
    }
    return code;
  });

export const tagCodeParamsSchema = z.object({ code: tagCodeSchema });

export const MAX_LABELS_PER_RUN = 1000;

export const createPrintRunSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('equipment'),
    equipmentIds: z
      .array(z.uuid())
      .min(1, 'Choose at least one piece of equipment.')
      .max(MAX_LABELS_PER_RUN, `At most ${MAX_LABELS_PER_RUN} labels per print run.`)
      .refine((ids) => new Set(ids).size === ids.length, 'Each piece of equipment once.'),
    /** Equipment that already carries a tag: skip it (default) or print a replacement and retire the old tag. */
    alreadyTagged: z.enum(['skip', 'replace']).default('skip'),
    layoutId: z.string().min(1, 'Choose a label layout.').max(40),
    startPosition: z.number().int().min(1).max(800).default(1),
  }),
  z.object({
    kind: z.literal('blank'),
    siteId: z.uuid('Choose a site.'),
    count: z
      .number({ message: 'How many blank tags?' })
      .int('Use a whole number.')
      .min(1, 'At least one tag.')
      .max(MAX_LABELS_PER_RUN, `At most ${MAX_LABELS_PER_RUN} labels per print run.`),
    layoutId: z.string().min(1, 'Choose a label layout.').max(40),
    startPosition: z.number().int().min(1).max(800).default(1),
  }),
]);
export type CreatePrintRunInput = z.infer<typeof createPrintRunSchema>;

export const listPrintRunsQuerySchema = listQueryBase.pick({ cursor: true, limit: true });
export type ListPrintRunsQuery = z.infer<typeof listPrintRunsQuerySchema>;

/** Claiming a blank tag (or replacing a tag): attach it to existing equipment or to new equipment. */
export const attachTagSchema = z.union([
  z.object({ equipmentId: z.uuid('Choose the equipment.') }),
  z.object({
    newEquipment: z.object({
      type: z.string().min(1, 'Choose an equipment type.'),
      name: z.string().trim().min(1, 'Name is required.').max(120, 'Use at most 120 characters.'),
      areaId: z.uuid().nullable().optional(),
      make: optionalText(80),
      model: optionalText(80),
      serial: optionalText(80),
    }),
  }),
]);
export type AttachTagInput = z.infer<typeof attachTagSchema>;

export const retireTagSchema = z.object({
  reason: z.enum(['damaged', 'lost', 'unused'], { message: 'Choose why the tag is retired.' }),
  note: optionalText(500),
});
export type RetireTagInput = z.infer<typeof retireTagSchema>;

export const scanSchema = z.object({ code: tagCodeSchema, via: z.enum(SCAN_VIA).default('link') });
export type ScanInput = z.infer<typeof scanSchema>;

export const calibrationQuerySchema = z.object({ layoutId: z.string().min(1).max(40) });
