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
const LOCK_SECONDS = 60;

/** Retry delay grows with each attempt: 15 s, 30 s, 1 min … capped at 1 hour. */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(3600, 15 * 2 ** Math.max(0, attempts - 1));
}

/**
 * Deliver due messages. Rows are claimed with SKIP LOCKED and a lease, so several app copies can
 * run this at once without sending a message twice; a message is marked sent right after the
 * server accepts it, and its fixed Message-ID lets receivers drop a duplicate if a crash falls
 * exactly between the two.
 */
export async function deliverDueMail(limit = 20, db: Kysely<DB> = defaultDb): Promise<{ sent: number; failed: number }> {
  const claimed = await db
    .updateTable('mail_outbox')
    .set({ locked_until: sql`now() + make_interval(secs => ${LOCK_SECONDS})` })
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
    try {
      await mailTransport.sendMail({
        from: env.MAIL_FROM,
        to: m.to_addresses,
        subject: m.subject,
        text: m.text_body,
        html: m.html_body ?? undefined,
        messageId: m.message_id,
      });
      await db
        .updateTable('mail_outbox')
        .set({ status: 'sent', sent_at: sql`now()`, attempts: m.attempts + 1, locked_until: null, last_error: null })
        .where('id', '=', m.id)
        .execute();
      sent++;
    } catch (error) {
      const attempts = m.attempts + 1;
      const message = error instanceof Error ? error.message : String(error);
      await db
        .updateTable('mail_outbox')
        .set({
          attempts,
          last_error: message.slice(0, 500),
          locked_until: null,
          status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
          next_attempt_at: sql`now() + make_interval(secs => ${retryDelaySeconds(attempts)})`,
        })
        .where('id', '=', m.id)
        .execute();
      logger.warn({ outboxId: m.id, attempts, err: message }, 'mail delivery failed; will retry');
      failed++;
    }
  }
  return { sent, failed };
}

/** Fire-and-forget delivery right after a commit, so mail normally leaves within a second. */
export function kickMailDelivery(): void {
  deliverDueMail().catch((error: unknown) => logger.warn({ err: String(error) }, 'mail delivery pass failed'));
}
