import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { needsAttention } from '@/lib/attention/service';
import { rankingRule } from '@/lib/attention/rank';

const querySchema = z.object({ siteId: z.uuid().optional() });

// GET /api/overview/attention: units that need attention, ranked, each reason linked to its evidence.
export const GET = withApi({ permission: 'overview.read', query: querySchema }, async ({ actor, query }) => ({
  rule: rankingRule,
  items: await needsAttention(actor, query.siteId ?? null),
  nextCursor: null,
}));
