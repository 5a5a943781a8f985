import { NextResponse } from 'next/server';
import { checkHealth, isServiceDown } from '@/lib/health/service';

export const dynamic = 'force-dynamic';

// GET /api/health: public liveness of the database, object store and mail server (503 naming the
// failing one), and the outbox backlog (mail unsent after 5 minutes: degraded with the count, 200).
export async function GET(): Promise<Response> {
  const report = await checkHealth();
  return NextResponse.json(report, { status: isServiceDown(report) ? 503 : 200, headers: { 'Cache-Control': 'no-store' } });
}
