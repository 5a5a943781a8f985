// A second `npm start` runs the migrations and the demo loader again: both must keep all data.
import { execFileSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/docker-free-scripts/demo/scenario';
import { createTestDb, resetToDemo } from '@/tests/helpers/db';

const db = createTestDb();
afterAll(async () => {
  await db.destroy();
});

async function snapshot() {
  const tables = ['companies', 'users', 'clients', 'sites', 'areas'] as const;
  const out: Record<string, number> = {};
  for (const t of tables) out[t] = (await db.selectFrom(t).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n;
  return out;
}

describe('demo data on a second start', () => {
  it('loads once, then leaves existing and user-made data alone', async () => {
    await resetToDemo(db);
    const company = await db.selectFrom('companies').select('id').executeTakeFirstOrThrow();
    await db.insertInto('clients').values({ company_id: company.id, name: 'Made by a user' }).execute();
    const before = await snapshot();
    expect(before).toMatchObject({ companies: 1, users: 5, clients: 3, sites: 5, areas: 18 });
    // What npm start runs on every start, in the same order.
    execFileSync('node_modules/.bin/tsx', ['db/migrate.ts', 'latest'], { env: process.env, stdio: 'pipe' });
    execFileSync('node_modules/.bin/tsx', ['docker-free-scripts/seed.ts'], { env: process.env, stdio: 'pipe' });
    expect(await seedDemo(db)).toBe(false);
    expect(await snapshot()).toEqual(before);
    expect(await db.selectFrom('clients').select('id').where('name', '=', 'Made by a user').executeTakeFirst()).toBeDefined();
    // Two cold tsx processes: on a busy shared machine each can take most of a minute to start.
  }, 180_000);
});
