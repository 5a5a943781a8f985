// /api/health is green with every service up, 503 naming the object store when it stops, and
// degraded (still 200) with the count when mail has waited in the outbox for over 5 minutes, and
// when mail was given up after every retry in the last 7 days.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestDb, resetToDemo } from '@/tests/helpers/db';
import { openTestObjectStore } from '@/tests/helpers/front-port';

const db = createTestDb();
beforeAll(async () => {
  await resetToDemo(db);
  await db.deleteFrom('mail_outbox').execute();
});
afterAll(async () => {
  await db.destroy();
});

const healthy = {
  status: 'ok',
  checks: { database: 'ok', storage: 'ok', mail: 'ok', outbox: 'ok', undelivered: 'ok' },
  outbox: { waitingOver5Minutes: 0, givenUpLast7Days: 0 },
};

/** Degraded with these checks and outbox counts (the other checks ok). */
const degraded = (checks: Partial<typeof healthy.checks>, outbox: typeof healthy.outbox) => ({ ...healthy, status: 'degraded', checks: { ...healthy.checks, ...checks }, outbox });

/** GET /api/health answers 200 (a degraded answer too) with exactly this body. */
async function expectHealth(body: object): Promise<void> {
  const { GET } = await import('@/app/api/health/route');
  const res = await GET();
  expect(res.status).toBe(200);
  expect(await res.json()).toEqual(body);
}

describe('GET /api/health', () => {
  it('answers 200 when database, storage and mail answer and no mail waits', async () => {
    await expectHealth(healthy);
  });

  it('answers 503 naming storage while the object store is stopped, and 200 again when it is back', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'rl-health-s3-'));
    const store = await openTestObjectStore(dir, ['health-check']);
    vi.resetModules();
    vi.stubEnv('S3_ENDPOINT', store.endpoint);
    vi.stubEnv('S3_BUCKET', 'health-check');
    delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
    try {
      await store.start();
      const { GET } = await import('@/app/api/health/route');
      expect((await GET()).status).toBe(200);
      await store.stop();
      const down = await GET();
      expect(down.status).toBe(503);
      expect(await down.json()).toEqual(degraded({ storage: 'failing' }, healthy.outbox));
      await store.start();
      expect((await GET()).status).toBe(200);
    } finally {
      await store.close();
      rmSync(dir, { recursive: true, force: true });
      vi.unstubAllEnvs();
      vi.resetModules();
      delete (globalThis as { rimelineS3?: unknown }).rimelineS3;
    }
  });

  const queue = async (n: number) => {
    const { enqueueMail } = await import('@/lib/mail/outbox');
    const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
    return enqueueMail({ companyId: company.id, kind: 'visit_report', to: [`outbox${n}@example.test`], subject: `Outbox ${n}`, text: 'Body' }, db);
  };
  /** Queued `minutes` ago, in `status`. */
  const age = (id: string, minutes: number, status = 'pending') =>
    db.updateTable('mail_outbox').set({ created_at: sql`now() - make_interval(mins => ${minutes})`, status }).where('id', '=', id).execute();

  it('reports mail unsent for over 5 minutes as a backlog: degraded, with the count, still 200', async () => {
    try {
      // Fresh mail, and old mail that was sent, is no backlog (nor is mail given up: next case).
      const fresh = await queue(1);
      await age(fresh, 4);
      await age(await queue(2), 30, 'sent');
      await expectHealth(healthy);

      // Two messages older than 5 minutes, still pending: degraded with the count.
      await age(await queue(4), 6);
      await age(await queue(5), 90);
      await expectHealth(degraded({ outbox: 'backlog' }, { waitingOver5Minutes: 2, givenUpLast7Days: 0 }));
    } finally {
      await db.deleteFrom('mail_outbox').execute();
    }
  });

  it('reports mail given up in the last 7 days as undelivered: degraded, with the count, still 200', async () => {
    try {
      // Given up over 7 days ago: no longer counted (nothing re-sends it, so it would never clear).
      await age(await queue(1), 8 * 24 * 60, 'failed');
      await age(await queue(2), 30, 'sent');
      await expectHealth(healthy);

      await age(await queue(3), 30, 'failed');
      await age(await queue(4), 6 * 24 * 60, 'failed');
      // A backlog at the same time is reported beside it, each with its own count.
      await age(await queue(5), 20);
      await expectHealth(degraded({ outbox: 'backlog', undelivered: 'given_up' }, { waitingOver5Minutes: 1, givenUpLast7Days: 2 }));
    } finally {
      await db.deleteFrom('mail_outbox').execute();
    }
  });

  it('marks a message given up after the last try, and health then counts it', async () => {
    const { deliverDueMail } = await import('@/lib/mail/outbox');
    const { GET } = await import('@/app/api/health/route');
    const { logger } = await import('@/lib/logger');
    const errors: string[] = [];
    const spy = vi.spyOn(logger, 'error').mockImplementation(((_obj: unknown, msg: string) => void errors.push(msg)) as never);
    try {
      // One try short of giving up, and due; the mail server refuses it this once.
      const id = await queue(6);
      await db.updateTable('mail_outbox').set({ attempts: 11 }).where('id', '=', id).execute();
      const { mailTransport } = await import('@/lib/mail/transport');
      const send = vi.spyOn(mailTransport, 'sendMail').mockRejectedValue(new Error('550 mailbox unavailable') as never);
      try {
        expect(await deliverDueMail(20, db)).toEqual({ sent: 0, failed: 1 });
      } finally {
        send.mockRestore();
      }
      expect(await db.selectFrom('mail_outbox').select(['status', 'attempts']).where('id', '=', id).executeTakeFirstOrThrow()).toEqual({ status: 'failed', attempts: 12 });
      expect(errors).toEqual(['mail delivery failed for good; given up']);
      const res = await GET();
      expect(await res.json()).toMatchObject({ status: 'degraded', checks: { undelivered: 'given_up' }, outbox: { givenUpLast7Days: 1 } });
    } finally {
      spy.mockRestore();
      await db.deleteFrom('mail_outbox').execute();
    }
  });
});
