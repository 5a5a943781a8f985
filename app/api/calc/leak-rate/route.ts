import { withApi } from '@/lib/api/handler';
import { REFERENCE_CAUTION, refrigerantCautions } from '@/lib/calc/cautions';
import { evaluateLeakEvent } from '@/lib/calc/leak-rate';
import { getRefrigerant } from '@/lib/calc/refrigerants';
import { leakEventSchema } from '@/lib/calc/schemas';

// GET /api/calc/leak-rate: one refrigerant addition: annualized leak rate, threshold, repair and verification deadlines.
export const GET = withApi({ permission: 'calc.use', query: leakEventSchema }, async ({ query }) => {
  const result = evaluateLeakEvent(query);
  return { ...result, temperatureUnit: query.temperatureUnit ?? 'C', cautions: [...result.cautions, ...refrigerantCautions(getRefrigerant(query.refrigerant)), REFERENCE_CAUTION] };
});
