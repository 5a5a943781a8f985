import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { needsAttention } from '@/lib/attention/service';
import { rankingRule } from '@/lib/attention/rank';

const querySchema = z.object({
  siteId: z.uuid().optional(),
  // The cursor is the position in the ranked list; the ranking is computed whole each time.
  cursor: z.string().regex(/^\d{1,7}$/, 'Use the nextCursor of the previous page.').optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

// GET /api/overview/attention: units that need attention, ranked, each reason linked to its evidence.
export const GET = withApi({ permission: 'overview.read', query: querySchema }, async ({ actor, query }) => {
  const all = await needsAttention(actor, query.siteId ?? null);
  const from = Number(query.cursor ?? 0);
  const to = from + query.limit;
  return { rule: rankingRule, total: all.length, items: all.slice(from, to), nextCursor: to < all.length ? String(to) : null };
});
