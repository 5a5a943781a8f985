import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { attentionPage } from '@/lib/attention/service';
import { rankingRule } from '@/lib/attention/rank';

const querySchema = z.object({
  siteId: z.uuid().optional(),
  // A keyset cursor: the rank of the last unit of the previous page (lib/attention/service.ts).
  cursor: z.string().max(2000).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

// GET /api/overview/attention: units that need attention, ranked, each reason linked to its evidence.
export const GET = withApi({ permission: 'overview.read', query: querySchema }, async ({ actor, query }) => {
  const page = await attentionPage(actor, { siteId: query.siteId ?? null, limit: query.limit, cursor: query.cursor ?? null });
  return { rule: rankingRule, total: page.total, items: page.items, nextCursor: page.nextCursor };
});
