import { withApi } from '@/lib/api/handler';
import { ENERGISED_WORK_CAUTION, REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { voltageUnbalance } from '@/lib/calc/electrical';
import { voltageUnbalanceQuerySchema } from '@/lib/calc/schemas';

// GET /api/calc/voltage-unbalance: three-phase voltage unbalance (NEMA MG 1) and the motor derating it implies.
export const GET = withApi({ permission: 'calc.use', query: voltageUnbalanceQuerySchema }, async ({ query }) => ({
  ...voltageUnbalance(query.lineVoltages),
  temperatureUnit: query.temperatureUnit,
  cautions: [ENERGISED_WORK_CAUTION, REFERENCE_CAUTION],
}));
