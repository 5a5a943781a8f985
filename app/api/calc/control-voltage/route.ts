import { withApi } from '@/lib/api/handler';
import { ENERGISED_WORK_CAUTION, REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { controlCircuitVoltage } from '@/lib/calc/electrical';
import { controlVoltageQuerySchema } from '@/lib/calc/schemas';

// GET /api/calc/control-voltage: a control-circuit voltage against its nominal (24 VAC by default):
// out below 85 % or above 110 %, marginal more than 5 % from nominal, ok otherwise.
export const GET = withApi({ permission: 'calc.use', query: controlVoltageQuerySchema }, async ({ query }) => ({
  ...controlCircuitVoltage(query),
  temperatureUnit: query.temperatureUnit ?? 'C',
  cautions: [ENERGISED_WORK_CAUTION, REFERENCE_CAUTION],
}));
