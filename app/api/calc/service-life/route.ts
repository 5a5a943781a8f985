import { withApi } from '@/lib/api/handler';
import { serviceLifeQuerySchema } from '@/lib/calc/schemas';
import { serviceLifeOutlook } from '@/lib/calc/service-life';

// GET /api/calc/service-life: equipment age, median service life (ASHRAE table) and a condition-weighted outlook.
export const GET = withApi({ permission: 'calc.use', query: serviceLifeQuerySchema }, async ({ query }) => {
  const result = serviceLifeOutlook(query);
  return { ...result, temperatureUnit: query.temperatureUnit ?? 'C', cautions: [result.caution] };
});
