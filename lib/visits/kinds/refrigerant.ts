import { z } from 'zod';
import { optionalText } from '@/lib/api/schemas';
import { evaluateLeakEvent } from '@/lib/calc/leak-rate';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import { formatQuantity } from '@/lib/units/quantities';
import { defineKind, EntryRefusal } from '@/lib/visits/kinds/types';
import { formatDay } from '@/lib/format/dates';
import { formatLeakRate } from '@/lib/format/numbers';

// Refrigerant added to or recovered from a system. An addition gets its annualized leak rate and,
// over the threshold, its repair deadline (lib/calc/leak-rate, 40 CFR 82.152 and 82.157).

export const refrigerantDataSchema = z.object({
  direction: z.enum(['added', 'recovered'], { message: 'Added or recovered?' }),
  amountKg: z.number({ message: 'Amount must be a number.' }).positive('Amount must be above zero.').max(2000, 'Amount is above 2000 kg.'),
  refrigerant: z.enum(REFRIGERANT_IDS, { message: 'Choose the refrigerant by its ASHRAE number.' }),
  cylinderId: optionalText(60),
  technicianCert: optionalText(60),
});
export type RefrigerantData = z.infer<typeof refrigerantDataSchema>;

/** Units that hold a system's charge, where additions and recoveries are recorded. */
const CHARGED = new Set(['condensing_unit', 'compressor', 'condenser', 'evaporator', 'other']);

type Application = 'commercial_refrigeration' | 'comfort_cooling' | 'industrial_process_refrigeration';

export const refrigerant = defineKind({
  kind: 'refrigerant',
  fits: (u) => CHARGED.has(u.type),
  data: refrigerantDataSchema,
  describe(d, computed, prefs) {
    const leak = computed?.leak as { ratePct?: number; thresholdPct?: number; exceedsThreshold?: boolean; repairDueDate?: string | null } | null | undefined;
    const rate = leak && typeof leak.ratePct === 'number' ? `; leak rate ${formatLeakRate(leak.ratePct)} (threshold ${leak.thresholdPct} %)` : '';
    const due = leak?.exceedsThreshold && leak.repairDueDate ? `; OVER THRESHOLD — repair due by ${formatDay(leak.repairDueDate)}` : '';
    return `Refrigerant ${d.direction}: ${formatQuantity(d.amountKg, 'mass', prefs)} of ${d.refrigerant}${d.cylinderId ? `, cylinder ${d.cylinderId}` : ''}${rate}${due}`;
  },
  async compute(d, tools) {
    const { ctx } = tools;
    if (ctx.refrigerant && d.refrigerant !== ctx.refrigerant) {
      throw new EntryRefusal(
        `This system holds ${ctx.refrigerant}. Never add a different refrigerant; record a retrofit on the system first.`,
        'data.refrigerant',
        `The system holds ${ctx.refrigerant}.`,
      );
    }
    if (d.direction !== 'added') return null;
    if (!ctx.systemId || !ctx.fullChargeKg || !ctx.application) return { leak: null, problems: ['The leak rate needs the system’s full charge and application on record.'] };
    const previous = await tools.lastAddition({ inclusive: false });
    const leak = evaluateLeakEvent({
      refrigerant: d.refrigerant,
      application: ctx.application === 'industrial_process' ? 'industrial_process_refrigeration' : (ctx.application as Application),
      fullCharge: ctx.fullChargeKg,
      added: d.amountKg,
      massUnit: 'kg',
      // Calendar days are the site's: an addition late in the evening counts on that local day.
      additionDate: tools.localDate(tools.recordedAt),
      previousAdditionDate: previous ? tools.localDate(previous.recordedAt) : null,
    });
    return { leak };
  },
});
