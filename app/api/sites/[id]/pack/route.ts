import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { getSitePack } from '@/lib/sites/pack';

// GET /api/sites/:id/pack: what a phone keeps of a site to work there without signal. Staff who
// record entries only (owners get 403); another company's or client's site reads as 404.
export const GET = withApi({ permission: 'entries.write', params: idParamsSchema }, async ({ actor, params }) => getSitePack(actor, params.id));
