// npm run backup: the database and every object of the bucket, at one point in time, into one
// folder (see docker-free-scripts/backup/create.ts for what it holds).
//
//   npm run backup                               the dev profile (or the app's environment, when
//                                                DATABASE_URL is set in the shell)
//   npm run backup -- --profile lane3            another local profile
//   npm run backup -- --out /mnt/backups/today   where to write (default backups/<UTC time>/)
//
// Exit status: 0 written, 1 failed (no folder is left under the final name).
import { parseArgs } from 'node:util';
import path from 'node:path';
import { bucketConfigFromEnv, describeBucket } from '@/docker-free-scripts/backup/bucket';
import { createBackup } from '@/docker-free-scripts/backup/create';
import { ensureLocalServices, type LocalServices } from '@/docker-free-scripts/backup/local-services';
import { applyProfile, describeDatabase } from '@/docker-free-scripts/backup/profile-env';

const { values: args } = parseArgs({
  options: {
    profile: { type: 'string' },
    out: { type: 'string' },
    help: { type: 'boolean', short: 'h', default: false },
  },
});
if (args.help) {
  console.log('Usage: npm run backup [-- --profile dev|test|laneN] [--out FOLDER]');
  process.exit(0);
}

let services: LocalServices | null = null;
let code = 0;
try {
  const profile = applyProfile(args.profile);
  if (profile) services = await ensureLocalServices(profile, (line) => console.log(line));
  const databaseUrl = process.env.DATABASE_URL!;
  const bucket = bucketConfigFromEnv();
  const stamp = new Date().toISOString().replace(/\.\d+Z$/, 'Z').replace(/:/g, '-');
  // Relative to where the person typed the command (npm runs scripts from the package root).
  const out = args.out ? path.resolve(process.env.INIT_CWD ?? process.cwd(), args.out) : path.resolve('backups', stamp);
  console.log(`Backing up the ${describeDatabase(databaseUrl)} and ${describeBucket(bucket)}${profile ? ` (profile ${profile})` : ''} into ${out}`);
  const m = await createBackup({ databaseUrl, bucket, out, log: (line) => console.log(line) });
  const rows = Object.values(m.database.tables).reduce((a, n) => a + n, 0);
  console.log(`Done: ${Object.keys(m.database.tables).length} tables (${rows} rows), ${m.objects.count} objects (${m.objects.bytes} bytes).`);
  if (m.problems.orphanObjects.length) console.log(`  ${m.problems.orphanObjects.length} object(s) no row refers to (listed in manifest.json, restored as they are)`);
  if (m.problems.missingObjects.length) console.log(`  ${m.problems.missingObjects.length} row(s) name an object the bucket did not have (listed in manifest.json)`);
  if (m.problems.afterSnapshot.length) console.log(`  ${m.problems.afterSnapshot.length} object(s) written after the snapshot (kept, not restored)`);
} catch (error) {
  console.error(`backup failed: ${error instanceof Error ? error.message : String(error)}`);
  code = 1;
} finally {
  await services?.stop();
}
process.exit(code);
