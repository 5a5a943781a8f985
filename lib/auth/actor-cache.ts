import 'server-only';
import { noticeChannel, type NoticeChannel } from '@/db/notices';
import type { Actor } from '@/lib/auth/actor';
import { env } from '@/lib/env';
import { logger } from '@/lib/logger';

// The signed-in person per live session, kept in memory so a request need not ask the database
// who is calling. Correct only because every change that could alter the answer is announced:
// triggers (migration 2026_12_05_0100) NOTIFY `rimeline_sessions` when a session ends (sign-out,
// sign out everywhere, expiry moved, and the credential trigger's role, client, password and
// deactivation changes) and when a person's own columns change, and PostgreSQL delivers that on
// commit to every app copy's listening connection. Rules for staying correct:
// - answer from memory only while the listener is up; when it drops, forget everything (notices
//   sent meanwhile are lost) and read the database on every request until it is back;
// - never store an answer whose read began before a notice arrived or before the listener was up
//   (generation);
// - never keep an entry past the session's own end, nor longer than KEEP_MS (a safety net for a
//   connection that died without anyone noticing).

export const SESSION_NOTICE_CHANNEL = 'rimeline_sessions';
const KEEP_MS = 60_000;
const MAX_ENTRIES = 10_000;
const RETRY_MS = 5_000;

interface Entry {
  userId: string;
  actor: Actor;
  expiresAtMs: number;
  keptUntilMs: number;
}

interface CacheState {
  entries: Map<string, Entry>;
  generation: number;
  channel: NoticeChannel | null;
  lastTryMs: number;
  /** Test hooks waiting for a notice or 'down'. */
  handled: Set<(event: string) => void>;
}

// One per process: route handlers and pages can be bundled apart, each with its own module copy.
const holder = globalThis as unknown as { rimelineActorCache?: CacheState };
const state = (): CacheState => (holder.rimelineActorCache ??= { entries: new Map(), generation: 0, channel: null, lastTryMs: 0, handled: new Set() });

function forgetWhere(match: (sessionId: string, e: Entry) => boolean): void {
  const s = state();
  s.generation++;
  for (const [id, e] of s.entries) if (match(id, e)) s.entries.delete(id);
}

/** Forgets one session at once in this process (sign-out); the notice does it everywhere else. */
export function forgetSession(sessionId: string): void {
  forgetWhere((id) => id === sessionId);
}

/** Forgets every session of a person in this process. */
export function forgetUserSessions(userId: string): void {
  forgetWhere((_, e) => e.userId === userId);
}

function handled(event: string): void {
  for (const done of [...state().handled]) done(event);
}

function handleNotice(payload: string): void {
  if (payload.startsWith('s:')) forgetSession(payload.slice(2));
  else if (payload.startsWith('u:')) forgetUserSessions(payload.slice(2));
  else forgetWhere(() => true);
  handled(payload);
}

function listening(s: CacheState): boolean {
  if (env.SESSION_NOTICES_URL === 'off') return false;
  if (!s.channel) {
    s.channel = noticeChannel(env.SESSION_NOTICES_URL ?? env.DATABASE_URL, SESSION_NOTICE_CHANNEL, {
      notice: handleNotice,
      up: () => forgetWhere(() => true),
      down: (error) => {
        logger.warn({ err: error?.message }, 'session notices stopped; reading the database on every request until they are back');
        forgetWhere(() => true);
        handled('down');
      },
    });
  }
  if (s.channel.up) return true;
  const now = Date.now();
  if (now - s.lastTryMs >= RETRY_MS) {
    s.lastTryMs = now;
    void s.channel.connect();
  }
  return false;
}

export type SessionLoader = (userId: string, sessionId: string) => Promise<{ actor: Actor; expiresAtMs: number } | null>;

/** The active person behind a live session: from memory when that is known to be current, else `load`. */
export async function cachedSessionActor(userId: string, sessionId: string, load: SessionLoader): Promise<Actor | null> {
  const s = state();
  const now = Date.now();
  const up = listening(s);
  const hit = s.entries.get(sessionId);
  if (hit && up && hit.userId === userId && hit.expiresAtMs > now && hit.keptUntilMs > now) return hit.actor;
  if (hit) s.entries.delete(sessionId);
  const generation = s.generation;
  const found = await load(userId, sessionId);
  if (!found) return null;
  if (s.channel?.up && generation === s.generation) {
    if (s.entries.size >= MAX_ENTRIES) s.entries.delete(s.entries.keys().next().value!);
    s.entries.set(sessionId, { userId, actor: found.actor, expiresAtMs: found.expiresAtMs, keptUntilMs: Date.now() + KEEP_MS });
  }
  return found.actor;
}

/** For tests: resolves once a notice equal to `event` (or the listener's loss, 'down') has been applied. */
export function sessionNoticeHandled(event: string): Promise<void> {
  const s = state();
  return new Promise((resolve) => {
    const done = (payload: string) => {
      if (payload !== event) return;
      s.handled.delete(done);
      resolve();
    };
    s.handled.add(done);
  });
}

/** For tests: waits until the listener is up (connecting now if needed); false if it cannot be. */
export async function sessionNoticesReady(): Promise<boolean> {
  const s = state();
  listening(s);
  await s.channel?.connect();
  return s.channel?.up ?? false;
}

/** For tests and shutdown: stops listening and forgets everything. */
export async function closeActorCache(): Promise<void> {
  const s = state();
  const channel = s.channel;
  s.channel = null;
  s.lastTryMs = 0;
  forgetWhere(() => true);
  await channel?.close();
}
