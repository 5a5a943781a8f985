// Loads the demo scenario once (npm start runs it every time; it does nothing the second time).
// A fresh demo also gets its history (equipment, visits, follow-ups, tags, photos, requests),
// written through the app's services, so it needs the app's environment and the object store.
import '@/docker-free-scripts/server-modules';
import type { Kysely } from 'kysely';
import nodemailer from 'nodemailer';
import { connectDb } from '@/db/connect';
import type { DB } from '@/db/schema.gen';
import { demoExists, seedDemo } from '@/docker-free-scripts/demo/scenario';
import { seedDemoLeakWork } from '@/docker-free-scripts/demo/leak-work';

const db = connectDb();
let appDb: Kysely<DB> | null = null;
try {
  // Data already there is never added to.
  if (await demoExists(db)) {
    console.log('  demo data already present; nothing changed');
  } else {
    // The history's visit reports and service requests are about the past: this process delivers
    // none of them (the transport module takes a transport cached here), and the history removes
    // its rows from the outbox when it is done.
    (globalThis as { rimelineMail?: unknown }).rimelineMail = nodemailer.createTransport({ jsonTransport: true });
    const { seedDemoHistory } = await import('@/docker-free-scripts/demo/history');
    const { ensureBucket } = await import('@/storage/objects');
    appDb = (await import('@/db')).db;
    // The object store is checked before anything is written, so a store that is down leaves no
    // half-loaded demo behind.
    await ensureBucket();
    await seedDemo(db);
    await seedDemoLeakWork(db);
    const started = Date.now();
    const counts = await seedDemoHistory(db).catch((error: unknown) => {
      console.error('  The demo history stopped part-way. Start again from an empty demo: bash docker-free-scripts/db-reset.sh --all');
      throw error;
    });
    const took = ((Date.now() - started) / 1000).toFixed(1);
    console.log(counts ? `  demo data loaded: ${counts.equipment} units, ${counts.visits} visits, ${counts.photos} photos (history ${took} s)` : '  demo data loaded');
  }
} finally {
  await db.destroy();
  await appDb?.destroy();
}
