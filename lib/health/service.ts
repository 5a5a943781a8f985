import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import { countMailBacklog } from '@/lib/mail/outbox';
import { mailTransport } from '@/lib/mail/transport';
import { checkBucket } from '@/storage/objects';

export type CheckState = 'ok' | 'failing';
export interface HealthReport {
  status: 'ok' | 'degraded';
  checks: { database: CheckState; storage: CheckState; mail: CheckState; outbox: 'ok' | 'backlog' | 'failing' };
  outbox: { waitingOver5Minutes: number | null };
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

/**
 * Whether a service is down (database, storage, mail: 503, so a load balancer can act) or the app
 * is up but mail is not leaving (outbox backlog: 200 with status degraded, since restarting or
 * removing this copy would not send it).
 */
export function isServiceDown(report: HealthReport): boolean {
  const { database, storage, mail } = report.checks;
  return [database, storage, mail].some((c) => c !== 'ok');
}

export async function checkHealth(): Promise<HealthReport> {
  let waiting: number | null = null;
  const [database, storage, mail, outboxState] = await Promise.all([
    probe(() => sql`select 1`.execute(db)),
    probe(() => checkBucket()),
    probe(() => mailTransport.verify()),
    probe(async () => {
      waiting = await countMailBacklog(db);
    }),
  ]);
  const outbox = outboxState === 'failing' ? 'failing' : waiting ? 'backlog' : 'ok';
  const checks = { database, storage, mail, outbox } as const;
  return {
    status: Object.values(checks).every((c) => c === 'ok') ? 'ok' : 'degraded',
    checks,
    outbox: { waitingOver5Minutes: waiting },
  };
}
