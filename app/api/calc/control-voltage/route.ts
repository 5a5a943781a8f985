import { withApi } from '@/lib/api/handler';
import { ENERGISED_WORK_CAUTION, REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { controlCircuitVoltage } from '@/lib/calc/electrical';
import { controlVoltageQuerySchema } from '@/lib/calc/schemas';

// GET /api/calc/control-voltage: a control-circuit voltage against its nominal (24 VAC ± 10 % by default).
export const GET = withApi({ permission: 'calc.use', query: controlVoltageQuerySchema }, async ({ query }) => ({
  ...controlCircuitVoltage(query),
  cautions: [ENERGISED_WORK_CAUTION, REFERENCE_CAUTION],
}));
