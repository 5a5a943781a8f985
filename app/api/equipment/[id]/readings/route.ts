import { z } from 'zod';
import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { readingFields } from '@/lib/visits/schemas';
import { readingSeries } from '@/lib/visits/history';

const keys: [string, ...string[]] = ['superheatK', 'subcoolingK', 'evaporatorTdK', 'condenserSplitK', 'compressionRatio', 'unbalancePct', 'evaporatingC', 'condensingC', ...Object.keys(readingFields)];
const querySchema = z.object({ key: z.enum(keys, { message: 'Choose a reading to plot.' }) });

// GET /api/equipment/:id/readings?key=…: one reading (measured or computed) over time, for a chart.
export const GET = withApi({ params: idParamsSchema, query: querySchema }, async ({ actor, params, query }) => ({
  key: query.key,
  points: await readingSeries(actor, params.id, query.key),
}));
