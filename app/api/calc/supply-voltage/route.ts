import { withApi } from '@/lib/api/handler';
import { ENERGISED_WORK_CAUTION, REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { supplyVoltageLines } from '@/lib/calc/supply-voltage';
import { supplyVoltageQuerySchema } from '@/lib/calc/schemas';

// GET /api/calc/supply-voltage: one measured voltage (measuredV) or three line voltages (v1, v2, v3)
// against the ANSI C84.1 ranges for the nameplate voltage; with three lines, the worst line decides.
export const GET = withApi({ permission: 'calc.use', query: supplyVoltageQuerySchema }, async ({ query }) => ({
  ...supplyVoltageLines(query),
  temperatureUnit: query.temperatureUnit,
  cautions: [ENERGISED_WORK_CAUTION, REFERENCE_CAUTION],
}));
