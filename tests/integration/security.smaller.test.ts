// Finding 8, the smaller ones: elevation is refused or kept, never turned into 0; the outbox keeps
// its lease while it records a sent message through a database outage, so nothing goes twice;
// pool errors are logged once per outage. (GET /api/company: access-matrix.test.ts.)
import { EventEmitter } from 'node:events';
import type { KyselyPlugin, PluginTransformQueryArgs, PluginTransformResultArgs, QueryResult, RootOperationNode, UnknownRow } from 'kysely';
import { sql } from 'kysely';
import { describe, expect, it, vi } from 'vitest';
import { watchPool } from '@/db';
import { deliverDueMail, enqueueMail } from '@/lib/mail/outbox';
import { createTestDb } from '@/tests/helpers/db';
import { mailTo } from '@/tests/helpers/mail';
import { signInOnDemo } from '@/tests/helpers/demo-session';
import { call, mockAuthModule } from '@/tests/helpers/session';

vi.mock('@/lib/auth', () => mockAuthModule());
const db = createTestDb();

signInOnDemo(db, 'office');

describe('site elevation', () => {
  it('null, "", [] and true are refused with 422 and the stored elevation stays', async () => {
    const site = await db.selectFrom('sites').select(['id', 'elevation_m']).where('elevation_m', '>', 0).executeTakeFirst();
    const id = site?.id ?? (await db.selectFrom('sites').select('id').executeTakeFirstOrThrow()).id;
    await db.updateTable('sites').set({ elevation_m: 1609 }).where('id', '=', id).execute();
    const { PATCH } = await import('@/app/api/sites/[id]/route');
    for (const elevationM of [null, '', [], true, '   ']) {
      const res = await call(PATCH as never, { method: 'PATCH', params: { id }, json: { elevationM } });
      expect(res.status, JSON.stringify(elevationM)).toBe(422);
      expect(res.body).toMatchObject({ error: { issues: [{ path: 'elevationM' }] } });
    }
    expect((await db.selectFrom('sites').select('elevation_m').where('id', '=', id).executeTakeFirstOrThrow()).elevation_m).toBe(1609);
    // Numbers, and numeric text from forms, still work; leaving it out keeps it.
    expect((await call(PATCH as never, { method: 'PATCH', params: { id }, json: { elevationM: '1200' } })).status).toBe(200);
    expect((await call(PATCH as never, { method: 'PATCH', params: { id }, json: { name: 'Renamed site' } })).status).toBe(200);
    expect((await db.selectFrom('sites').select('elevation_m').where('id', '=', id).executeTakeFirstOrThrow()).elevation_m).toBe(1200);
  });
});

/** Throws "connection terminated" for the next `count` statements that mark a message sent. */
class DroppedWhileMarking implements KyselyPlugin {
  constructor(public count: number) {}
  transformQuery(args: PluginTransformQueryArgs): RootOperationNode {
    if (args.node.kind === 'UpdateQueryNode' && JSON.stringify(args.node).includes('"sent"') && this.count > 0) {
      this.count--;
      throw new Error('Connection terminated unexpectedly');
    }
    return args.node;
  }
  async transformResult(args: PluginTransformResultArgs): Promise<QueryResult<UnknownRow>> {
    return args.result;
  }
}

describe('mail outbox lease', () => {
  it('a database outage after the mail server accepted a message does not send it twice', async () => {
    const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
    const to = `lease-${Date.now()}@example.test`;
    const id = await enqueueMail({ companyId: company.id, kind: 'test', to: [to], subject: 'Lease', text: 'Once' }, db);
    await db.updateTable('mail_outbox').set({ next_attempt_at: sql`now() - interval '1 second'` }).where('id', '=', id).execute();
    // Recording "sent" fails twice (the restart), then works: the message counts as sent once.
    expect(await deliverDueMail(20, db.withPlugin(new DroppedWhileMarking(2)), [5, 5, 5])).toEqual({ sent: 1, failed: 0 });
    const row = await db.selectFrom('mail_outbox').select(['status', 'attempts', 'message_id']).where('id', '=', id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ status: 'sent', attempts: 1 });
    await db.updateTable('mail_outbox').set({ next_attempt_at: sql`now() - interval '1 second'` }).where('id', '=', id).execute();
    expect(await deliverDueMail(20, db)).toEqual({ sent: 0, failed: 0 });
    const caught = await mailTo(to);
    expect(caught).toHaveLength(1);
    expect(caught[0]!.messageId).toBe(row.message_id);
  });

  it('an outage longer than the retries leaves the row leased, so no other pass sends it again meanwhile', async () => {
    const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
    const to = `lease-long-${Date.now()}@example.test`;
    const id = await enqueueMail({ companyId: company.id, kind: 'test', to: [to], subject: 'Lease', text: 'Once' }, db);
    expect(await deliverDueMail(20, db.withPlugin(new DroppedWhileMarking(99)), [5])).toEqual({ sent: 0, failed: 0 });
    const row = await db.selectFrom('mail_outbox').select(['status', sql<boolean>`locked_until > now() + interval '5 minutes'`.as('leased')]).where('id', '=', id).executeTakeFirstOrThrow();
    expect(row).toEqual({ status: 'pending', leased: true });
    expect(await deliverDueMail(20, db)).toEqual({ sent: 0, failed: 0 });
    expect(await mailTo(to)).toHaveLength(1);
  });
});

describe('pool errors', () => {
  it('are handled and logged once per outage', () => {
    const pool = new EventEmitter();
    const log = { error: vi.fn(), info: vi.fn() };
    watchPool(pool as never, log as never);
    for (let i = 0; i < 5; i++) pool.emit('error', new Error('terminating connection due to administrator command'));
    expect(log.error).toHaveBeenCalledTimes(1);
    pool.emit('connect');
    expect(log.info).toHaveBeenCalledTimes(1);
    pool.emit('error', new Error('again'));
    expect(log.error).toHaveBeenCalledTimes(2);
  });
});
