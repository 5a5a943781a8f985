import { withApi } from '@/lib/api/handler';
import { siteSummaries } from '@/lib/overview/service';

// GET /api/overview/sites: one condition summary per visible site.
export const GET = withApi({ permission: 'overview.read' }, async ({ actor }) => ({ items: await siteSummaries(actor), nextCursor: null }));
