// Loads the demo scenario once (npm start runs it every time; it does nothing the second time).
import { Kysely, PostgresDialect } from 'kysely';
import { pg } from '@/db/pg-types';
import type { DB } from '@/db/schema.gen';
import { seedDemo } from '@/db/seeds/demo';
import { seedDemoLeakWork } from '@/db/seeds/demo-leak-work';

const connectionString = process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/rimeline';
const db = new Kysely<DB>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString, max: 2 }) }) });
try {
  const created = await seedDemo(db);
  // The demo history goes only into a fresh demo: data already there is never added to.
  if (created) await seedDemoLeakWork(db);
  console.log(created ? '  demo data loaded' : '  demo data already present; nothing changed');
} finally {
  await db.destroy();
}
