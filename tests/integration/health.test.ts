// /api/health is green with every service up, 503 naming the object store when it stops, and
// degraded (still 200) with the count when mail has waited in the outbox for over 5 minutes.
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

const healthy = { status: 'ok', checks: { database: 'ok', storage: 'ok', mail: 'ok', outbox: 'ok' }, outbox: { waitingOver5Minutes: 0 } };

describe('GET /api/health', () => {
  it('answers 200 when database, storage and mail answer and no mail waits', async () => {
    const { GET } = await import('@/app/api/health/route');
    const res = await GET();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual(healthy);
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
      expect(await down.json()).toEqual({ ...healthy, status: 'degraded', checks: { ...healthy.checks, storage: 'failing' } });
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

  it('reports mail unsent for over 5 minutes as a backlog: degraded, with the count, still 200', async () => {
    const { enqueueMail } = await import('@/lib/mail/outbox');
    const { GET } = await import('@/app/api/health/route');
    const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
    const queue = (n: number) => enqueueMail({ companyId: company.id, kind: 'visit_report', to: [`backlog${n}@example.test`], subject: `Backlog ${n}`, text: 'Body' }, db);
    const age = (id: string, minutes: number, status = 'pending') =>
      db.updateTable('mail_outbox').set({ created_at: sql`now() - make_interval(mins => ${minutes})`, status }).where('id', '=', id).execute();
    try {
      // Fresh mail, and old mail that was sent or gave up, is no backlog.
      const fresh = await queue(1);
      await age(fresh, 4);
      await age(await queue(2), 30, 'sent');
      await age(await queue(3), 30, 'failed');
      let res = await GET();
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual(healthy);

      // Two messages older than 5 minutes, still pending: degraded with the count.
      await age(await queue(4), 6);
      await age(await queue(5), 90);
      res = await GET();
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ ...healthy, status: 'degraded', checks: { ...healthy.checks, outbox: 'backlog' }, outbox: { waitingOver5Minutes: 2 } });
    } finally {
      await db.deleteFrom('mail_outbox').execute();
    }
  });
});
