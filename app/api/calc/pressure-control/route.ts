import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { refrigerantResultCautions, SAFETY_CONTROL_CAUTION } from '@/lib/calc/cautions';
import { highPressureControl, lowPressureControl } from '@/lib/calc/pressure-controls';
import { getRefrigerant } from '@/lib/calc/refrigerants';
import { highPressureControlSchema, lowPressureControlSchema } from '@/lib/calc/schemas';

// One URL for both switch types, told apart by `type`; the field schemas are the shared ones.
const pressureControlQuerySchema = z.discriminatedUnion(
  'type',
  [lowPressureControlSchema.extend({ type: z.literal('low') }), highPressureControlSchema.extend({ type: z.literal('high') })],
  { error: 'type must be low or high' },
);

// GET /api/calc/pressure-control: low- or high-pressure switch settings, their saturation temperatures and warnings.
export const GET = withApi({ permission: 'calc.use', query: pressureControlQuerySchema }, async ({ query }) => {
  const result = query.type === 'low' ? lowPressureControl(query) : highPressureControl(query);
  return { type: query.type, ...result, cautions: refrigerantResultCautions(getRefrigerant(result.refrigerant), SAFETY_CONTROL_CAUTION) };
});
