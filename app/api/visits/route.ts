import { withApi } from '@/lib/api/handler';
import { listVisitsQuerySchema, startVisitSchema } from '@/lib/visits/schemas';
import { listVisits, startVisit } from '@/lib/visits/service';

// GET /api/visits: visits visible to the caller, newest first (owners see closed visits only).
export const GET = withApi({ query: listVisitsQuerySchema }, async ({ actor, query }) => listVisits(actor, query));

// POST /api/visits: start a visit at a site (one open visit per technician per site).
export const POST = withApi({ permission: 'visits.start', body: startVisitSchema, status: 201 }, async ({ actor, body }) => startVisit(actor, body));
