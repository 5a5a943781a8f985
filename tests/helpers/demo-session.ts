import type { Kysely } from 'kysely';
import { afterAll, beforeAll } from 'vitest';
import type { DB } from '@/db/schema.gen';
import { actorFor, demoEmails, resetToDemo } from '@/tests/helpers/db';
import { session } from '@/tests/helpers/session';

/** A test file's hooks: the demo reset once with `who` signed in (the stubbed session), the pool closed after all. */
export function signInOnDemo(db: Kysely<DB>, who: keyof typeof demoEmails): void {
  beforeAll(async () => {
    await resetToDemo(db);
    session.actor = await actorFor(db, demoEmails[who]);
  });
  afterAll(async () => {
    await db.destroy();
  });
}
