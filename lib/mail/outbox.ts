import 'server-only';
import { randomUUID } from 'node:crypto';
import { sql, type Kysely, type Transaction } from 'kysely';
import { db as defaultDb } from '@/db';
import type { DB } from '@/db/schema.gen';
import { env } from '@/lib/env';
import { logger } from '@/lib/logger';
import { mailTransport } from '@/lib/mail/transport';

export interface OutgoingMail {
  companyId: string | null;
  kind: string;
  to: string[];
  subject: string;
  text: string;
  html?: string;
}

/**
 * Queue a message in the same transaction as the change that causes it; nothing is sent here,
 * so a mail server outage never loses or blocks the change.
 */
export async function enqueueMail(mail: OutgoingMail, db: Kysely<DB> | Transaction<DB> = defaultDb): Promise<string> {
  const domain = new URL(env.APP_URL).hostname || 'rimeline.local';
  const row = await db
    .insertInto('mail_outbox')
    .values({
      company_id: mail.companyId,
      kind: mail.kind,
      to_addresses: mail.to,
      subject: mail.subject,
      text_body: mail.text,
      html_body: mail.html ?? null,
      message_id: `<${randomUUID()}@${domain}>`,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

const MAX_ATTEMPTS = 12;
/**
 * A claimed row stays leased this long: long enough for the mark-as-sent retries below, so a
 * database restart between "the server accepted it" and "marked sent" cannot make another pass
 * (or app copy) send the message again.
 */
const LEASE_SECONDS = 10 * 60;
/** Waits between tries to record a sent message (about four minutes in all, inside the lease). */
const MARK_RETRY_MS = [250, 500, 1000, 2000, 4000, 8000, 15000, 30000, 60000, 120000];

/** Retry delay grows with each attempt: 15 s, 30 s, 1 min … capped at 1 hour. */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(3600, 15 * 2 ** Math.max(0, attempts - 1));
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Tries `write` until it succeeds or the retries run out (then throws the last error). */
async function persistently(write: () => Promise<unknown>, delays: number[]): Promise<void> {
  for (let i = 0; ; i++) {
    try {
      await write();
      return;
    } catch (error) {
      if (i >= delays.length) throw error;
      await sleep(delays[i]!);
    }
  }
}

/**
 * Deliver due messages. Rows are claimed with SKIP LOCKED and a lease, so several app copies can
 * run this at once without sending a message twice. After the mail server accepts a message,
 * recording it as sent is retried through a database outage for as long as the lease lasts; a
 * failed send is recorded the same way, and a pass whose records cannot be written stops rather
 * than sending more. What remains at-least-once: the process dying (or the database staying away
 * longer than the lease) between acceptance and the record; the message is then sent again with
 * the same Message-ID, so receivers can drop the duplicate.
 */
export async function deliverDueMail(limit = 20, db: Kysely<DB> = defaultDb, markRetryMs = MARK_RETRY_MS): Promise<{ sent: number; failed: number }> {
  const claimed = await db
    .updateTable('mail_outbox')
    .set({ locked_until: sql`now() + make_interval(secs => ${LEASE_SECONDS})` })
    .where(
      'id',
      'in',
      db
        .selectFrom('mail_outbox')
        .select('id')
        .where('status', '=', 'pending')
        .where('next_attempt_at', '<=', sql<Date>`now()`)
        .where((eb) => eb.or([eb('locked_until', 'is', null), eb('locked_until', '<', sql<Date>`now()`)]))
        .orderBy('next_attempt_at')
        .limit(limit)
        .forUpdate()
        .skipLocked(),
    )
    .returningAll()
    .execute();

  let sent = 0;
  let failed = 0;
  for (const m of claimed) {
    let sendError: unknown = null;
    try {
      await mailTransport.sendMail({
        from: env.MAIL_FROM,
        to: m.to_addresses,
        subject: m.subject,
        text: m.text_body,
        html: m.html_body ?? undefined,
        messageId: m.message_id,
      });
    } catch (error) {
      sendError = error;
    }
    const attempts = m.attempts + 1;
    const message = sendError instanceof Error ? sendError.message : String(sendError);
    const record = sendError
      ? () =>
          db
            .updateTable('mail_outbox')
            .set({
              attempts,
              last_error: message.slice(0, 500),
              locked_until: null,
              status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
              next_attempt_at: sql`now() + make_interval(secs => ${retryDelaySeconds(attempts)})`,
            })
            .where('id', '=', m.id)
            .execute()
      : () =>
          db
            .updateTable('mail_outbox')
            .set({ status: 'sent', sent_at: sql`now()`, attempts, locked_until: null, last_error: null })
            .where('id', '=', m.id)
            .execute();
    try {
      await persistently(record, markRetryMs);
    } catch (error) {
      // The rows still leased stay untouched until their lease ends; nothing more is sent now.
      logger.error({ outboxId: m.id, sent: !sendError, err: String(error) }, 'mail outbox could not record a delivery; pass stopped');
      break;
    }
    if (sendError) {
      if (attempts >= MAX_ATTEMPTS) logger.error({ outboxId: m.id, attempts, err: message }, 'mail delivery failed for good; given up');
      else logger.warn({ outboxId: m.id, attempts, err: message }, 'mail delivery failed; will retry');
      failed++;
    } else {
      sent++;
    }
  }
  return { sent, failed };
}

/** Fire-and-forget delivery right after a commit, so mail normally leaves within a second. */
export function kickMailDelivery(): void {
  deliverDueMail().catch((error: unknown) => logger.warn({ err: String(error) }, 'mail delivery pass failed'));
}

/** Mail still waiting to go out (not sent, not given up) this long is a backlog worth reporting. */
export const BACKLOG_AFTER_MINUTES = 5;
/**
 * Mail given up (status `failed`, after MAX_ATTEMPTS tries) counts against health while it is this
 * recent: nothing re-sends it, so counting it for ever would keep health degraded for ever.
 */
export const GIVEN_UP_WITHIN_DAYS = 7;

/**
 * For /api/health, in one query: messages still pending after BACKLOG_AFTER_MINUTES, and messages
 * given up that were queued within GIVEN_UP_WITHIN_DAYS.
 */
export async function countMailTrouble(db: Kysely<DB> = defaultDb): Promise<{ backlog: number; givenUp: number }> {
  const row = await db
    .selectFrom('mail_outbox')
    .select((eb) => [
      eb.fn
        .countAll<string>()
        .filterWhere((f) => f.and([f('status', '=', 'pending'), f('created_at', '<', sql<Date>`now() - make_interval(mins => ${BACKLOG_AFTER_MINUTES})`)]))
        .as('backlog'),
      eb.fn
        .countAll<string>()
        .filterWhere((f) => f.and([f('status', '=', 'failed'), f('created_at', '>', sql<Date>`now() - make_interval(days => ${GIVEN_UP_WITHIN_DAYS})`)]))
        .as('given_up'),
    ])
    .where('status', 'in', ['pending', 'failed'])
    .executeTakeFirstOrThrow();
  return { backlog: Number(row.backlog), givenUp: Number(row.given_up) };
}
