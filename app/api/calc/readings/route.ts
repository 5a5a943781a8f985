import { withApi } from '@/lib/api/handler';
import { CERTIFIED_WORK_CAUTION, refrigerantResultCautions } from '@/lib/calc/cautions';
import { computeReadings } from '@/lib/calc/readings';
import { getRefrigerant } from '@/lib/calc/refrigerants';
import { SATURATION_BASIS } from '@/lib/calc/saturation';
import { readingsInputSchema } from '@/lib/calc/schemas';

// GET /api/calc/readings: superheat, subcooling, evaporator TD, condenser split and compression ratio from gauge readings.
export const GET = withApi({ permission: 'calc.use', query: readingsInputSchema }, async ({ query }) => {
  const result = computeReadings(query);
  // Each value carries its level and band; suggestions are a guide (common practice), never a verdict.
  // Each reading carries its formula's basis; the top-level basis is the saturation data behind them.
  return { ...result, basis: SATURATION_BASIS, cautions: refrigerantResultCautions(getRefrigerant(result.refrigerant), CERTIFIED_WORK_CAUTION) };
});
