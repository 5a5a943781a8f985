import { NextResponse } from 'next/server';
import { checkHealth } from '@/lib/health/service';

export const dynamic = 'force-dynamic';

// GET /api/health: public liveness of the database, object store and mail server (503 naming the failing one).
export async function GET(): Promise<Response> {
  const report = await checkHealth();
  return NextResponse.json(report, { status: report.status === 'ok' ? 200 : 503, headers: { 'Cache-Control': 'no-store' } });
}
