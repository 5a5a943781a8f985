import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import { countMailTrouble } from '@/lib/mail/outbox';
import { mailTransport } from '@/lib/mail/transport';
import { checkBucket } from '@/storage/objects';

export type CheckState = 'ok' | 'failing';
export interface HealthReport {
  status: 'ok' | 'degraded';
  checks: {
    database: CheckState;
    storage: CheckState;
    mail: CheckState;
    outbox: 'ok' | 'backlog' | 'failing';
    undelivered: 'ok' | 'given_up' | 'failing';
  };
  /** null when the outbox could not be counted (both outbox checks then say failing). */
  outbox: { waitingOver5Minutes: number | null; givenUpLast7Days: number | null };
}

const TIMEOUT_MS = 3_000;

/** fn's result, or null when it throws or takes longer than TIMEOUT_MS. */
async function attempt<T>(fn: () => Promise<T>): Promise<T | null> {
  let timer: NodeJS.Timeout | undefined;
  try {
    return await Promise.race([
      fn(),
      new Promise<never>((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), TIMEOUT_MS);
      }),
    ]);
  } catch {
    return null;
  } finally {
    clearTimeout(timer);
  }
}

async function probe(fn: () => Promise<unknown>): Promise<CheckState> {
  return (await attempt(async () => (await fn(), true))) ? 'ok' : 'failing';
}

/**
 * Whether a service is down (database, storage, mail: 503, so a load balancer can act) or the app
 * is up but mail is not leaving (outbox backlog) or was given up after every retry (undelivered):
 * 200 with status degraded, since restarting or removing this copy would not send it.
 */
export function isServiceDown(report: HealthReport): boolean {
  const { database, storage, mail } = report.checks;
  return [database, storage, mail].some((c) => c !== 'ok');
}

export async function checkHealth(): Promise<HealthReport> {
  const [database, storage, mail, counts] = await Promise.all([
    probe(() => sql`select 1`.execute(db)),
    probe(() => checkBucket()),
    probe(() => mailTransport.verify()),
    attempt(() => countMailTrouble(db)),
  ]);
  const outbox = !counts ? 'failing' : counts.backlog ? 'backlog' : 'ok';
  const undelivered = !counts ? 'failing' : counts.givenUp ? 'given_up' : 'ok';
  const checks = { database, storage, mail, outbox, undelivered } as const;
  return {
    status: Object.values(checks).every((c) => c === 'ok') ? 'ok' : 'degraded',
    checks,
    outbox: { waitingOver5Minutes: counts?.backlog ?? null, givenUpLast7Days: counts?.givenUp ?? null },
  };
}
