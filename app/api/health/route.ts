import { jsonResponse } from '@/lib/api/handler';
import { checkHealth, isServiceDown } from '@/lib/health/service';

export const dynamic = 'force-dynamic';

// GET /api/health: public liveness of the database, object store and mail server (503 naming the
// failing one), the outbox backlog (mail unsent after 5 minutes) and mail given up after every
// retry in the last 7 days: either is degraded with its count, still 200.
export async function GET(): Promise<Response> {
  const report = await checkHealth();
  return jsonResponse(report, isServiceDown(report) ? 503 : 200, { 'Cache-Control': 'no-store' });
}
