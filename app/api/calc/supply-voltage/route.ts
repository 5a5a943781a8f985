import { withApi } from '@/lib/api/handler';
import { ENERGISED_WORK_CAUTION, REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { supplyVoltageCheck } from '@/lib/calc/electrical';
import { supplyVoltageQuerySchema } from '@/lib/calc/schemas';

// GET /api/calc/supply-voltage: a measured supply voltage against the ANSI C84.1 ranges for the nameplate voltage.
export const GET = withApi({ permission: 'calc.use', query: supplyVoltageQuerySchema }, async ({ query }) => ({
  ...supplyVoltageCheck(query),
  cautions: [ENERGISED_WORK_CAUTION, REFERENCE_CAUTION],
}));
