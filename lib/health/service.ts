import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import { mailTransport } from '@/lib/mail/transport';
import { checkBucket } from '@/storage/objects';

export type CheckState = 'ok' | 'failing';
export interface HealthReport {
  status: 'ok' | 'degraded';
  checks: { database: CheckState; storage: CheckState; mail: CheckState };
}

const TIMEOUT_MS = 3_000;

async function probe(fn: () => Promise<unknown>): Promise<CheckState> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      fn(),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), TIMEOUT_MS);
      }),
    ]);
    return 'ok';
  } catch {
    return 'failing';
  } finally {
    clearTimeout(timer);
  }
}

export async function checkHealth(): Promise<HealthReport> {
  const [database, storage, mail] = await Promise.all([
    probe(() => sql`select 1`.execute(db)),
    probe(() => checkBucket()),
    probe(() => mailTransport.verify()),
  ]);
  const checks = { database, storage, mail };
  return { status: Object.values(checks).every((c) => c === 'ok') ? 'ok' : 'degraded', checks };
}
