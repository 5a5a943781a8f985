// A mail-server outage followed by recovery delivers every queued message exactly once, even with
// two delivery passes running at the same time (as two app copies would).
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { SMTPServer } from 'smtp-server';
import { sql } from 'kysely';
import { createTestDb, resetToDemo } from '@/tests/helpers/db';
import { listenOnFreePort, openFrontPort, type FrontPort } from '@/tests/helpers/front-port';

const db = createTestDb();
// The app is pointed at a front port that refuses connections until the SMTP server starts.
let front: FrontPort;
const received: string[] = [];

function startSmtp(): Promise<SMTPServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      let raw = '';
      stream.on('data', (c: Buffer) => (raw += c.toString()));
      stream.on('end', () => {
        received.push(/^Message-ID:\s*(.+)$/im.exec(raw)?.[1]?.trim() ?? '?');
        callback();
      });
    },
  });
  return listenOnFreePort(server.server).then((port) => {
    front.setTarget(port);
    return server;
  });
}

let outbox: typeof import('@/lib/mail/outbox');

beforeAll(async () => {
  await resetToDemo(db);
  front = await openFrontPort();
  vi.stubEnv('SMTP_URL', `smtp://127.0.0.1:${front.port}`);
  vi.resetModules();
  delete (globalThis as { rimelineMail?: unknown }).rimelineMail;
  outbox = await import('@/lib/mail/outbox');
});
afterAll(async () => {
  await front.close();
  vi.unstubAllEnvs();
  delete (globalThis as { rimelineMail?: unknown }).rimelineMail;
  await db.destroy();
});

describe('mail outbox', () => {
  it('keeps mail through an outage and sends each message once after recovery', async () => {
    const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
    const ids: string[] = [];
    for (const n of [1, 2, 3]) {
      ids.push(await outbox.enqueueMail({ companyId: company.id, kind: 'visit_report', to: [`contact${n}@example.test`], subject: `Report ${n}`, text: `Body ${n}` }, db));
    }
    // The server is down: every attempt fails, nothing is lost, each is scheduled for a retry.
    const down = await outbox.deliverDueMail(20, db);
    expect(down).toEqual({ sent: 0, failed: 3 });
    const pending = await db.selectFrom('mail_outbox').selectAll().where('id', 'in', ids).execute();
    expect(pending.every((m) => m.status === 'pending' && m.attempts === 1 && m.last_error && m.next_attempt_at > new Date())).toBe(true);

    const server = await startSmtp();
    try {
      // Not due yet: nothing goes out before the retry time.
      expect(await outbox.deliverDueMail(20, db)).toEqual({ sent: 0, failed: 0 });
      await db.updateTable('mail_outbox').set({ next_attempt_at: sql`now()` }).where('id', 'in', ids).execute();
      const [a, b] = await Promise.all([outbox.deliverDueMail(20, db), outbox.deliverDueMail(20, db)]);
      expect(a.sent + b.sent).toBe(3);
      expect(await outbox.deliverDueMail(20, db)).toEqual({ sent: 0, failed: 0 });
    } finally {
      await new Promise<void>((r) => server.close(() => r()));
    }
    const rows = await db.selectFrom('mail_outbox').select(['status', 'message_id']).where('id', 'in', ids).execute();
    expect(rows.every((r) => r.status === 'sent')).toBe(true);
    expect(received.sort()).toEqual(rows.map((r) => r.message_id).sort());
  });
});
