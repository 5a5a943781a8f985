import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { chartData } from '@/lib/overview/service';

const querySchema = z.object({ siteId: z.uuid().optional() });

// GET /api/overview/charts: condition distribution, age against expected life, refrigerant added per year, visits per month.
export const GET = withApi({ permission: 'overview.read', query: querySchema }, async ({ actor, query }) => chartData(actor, query.siteId ?? null));
