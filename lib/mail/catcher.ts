import 'server-only';
import { z } from 'zod';
import { assertCan } from '@/lib/auth/access';
import type { Actor } from '@/lib/auth/actor';
import { env } from '@/lib/env';
import { AppError } from '@/lib/errors';

// Reads the local mail catcher's HTTP API (embedded setup only), so a newcomer can follow links
// from invitations and sign-in mails without a real mailbox.
const messageSchema = z.object({
  id: z.string(),
  to: z.union([z.array(z.string()), z.string()]).transform((v) => (Array.isArray(v) ? v : [v])),
  from: z.string().optional().default(''),
  subject: z.string().optional().default('(no subject)'),
  date: z.string(),
  text: z.string().optional().nullable(),
  html: z.string().optional().nullable(),
});
export type CaughtMail = z.infer<typeof messageSchema>;

export function mailCatcherEnabled(): boolean {
  return Boolean(env.MAIL_CATCHER_URL);
}

async function catcherGet(path: string): Promise<unknown> {
  if (!env.MAIL_CATCHER_URL) throw new AppError('not_found', 'No local mail catcher is configured.');
  const res = await fetch(new URL(path, env.MAIL_CATCHER_URL), { cache: 'no-store', signal: AbortSignal.timeout(3000) }).catch(() => null);
  if (!res) throw new AppError('unavailable', 'The local mail catcher is not answering.');
  if (res.status === 404) throw new AppError('not_found', 'Message not found.');
  if (!res.ok) throw new AppError('unavailable', 'The local mail catcher is not answering.');
  return res.json();
}

export async function listCaughtMail(actor: Actor): Promise<CaughtMail[]> {
  assertCan(actor, 'mail.inbox');
  const data = await catcherGet('/messages');
  const list = Array.isArray(data) ? data : ((data as { items?: unknown[] })?.items ?? []);
  return z.array(messageSchema).parse(list);
}

export async function getCaughtMail(actor: Actor, id: string): Promise<CaughtMail> {
  assertCan(actor, 'mail.inbox');
  return messageSchema.parse(await catcherGet(`/messages/${encodeURIComponent(id)}`));
}
