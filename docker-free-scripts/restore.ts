// npm run restore: loads a backup folder (npm run backup) into an empty database and bucket, then
// runs the photo storage check (npm run photos:check) against the manifest.
//
//   npm run restore -- backups/2026-12-04T18-00-00Z                   into the dev profile
//   npm run restore -- backups/2026-12-04T18-00-00Z --profile lane3   into another local profile
//   npm run restore -- <folder> --replace                             delete what the target holds first
//
// The target is DATABASE_URL and S3_* (see backup/profile-env.ts for how they are chosen). The
// database is created when it does not exist, the bucket too. Stop the app that uses the target
// before --replace.
// Exit status: 0 restored and consistent (problems the backup already listed are reported, not
// counted); 1 failed, or the check found problems the backup did not have; 2 refused, nothing changed.
import '@/docker-free-scripts/server-modules';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { bucketConfigFromEnv, describeBucket } from '@/docker-free-scripts/backup/bucket';
import { ensureLocalServices, type LocalServices } from '@/docker-free-scripts/backup/local-services';
import { applyProfile, describeDatabase } from '@/docker-free-scripts/backup/profile-env';
import { readArchive, RestoreRefused, restoreBackup } from '@/docker-free-scripts/backup/restore';

const { values: args, positionals } = parseArgs({
  allowPositionals: true,
  options: {
    profile: { type: 'string' },
    replace: { type: 'boolean', default: false },
    force: { type: 'boolean', default: false },
    help: { type: 'boolean', short: 'h', default: false },
  },
});
if (args.help || positionals.length !== 1) {
  console.log('Usage: npm run restore -- <backup folder> [--profile dev|test|laneN] [--replace]');
  process.exit(args.help ? 0 : 2);
}

let code = 0;
let services: LocalServices | null = null;
try {
  // Relative to where the person typed the command (npm runs scripts from the package root).
  const archive = path.resolve(process.env.INIT_CWD ?? process.cwd(), positionals[0]!);
  await readArchive(archive); // a wrong folder is refused before any service starts
  const profile = applyProfile(args.profile);
  if (profile) services = await ensureLocalServices(profile, (line) => console.log(line));
  const databaseUrl = process.env.DATABASE_URL!;
  const bucket = bucketConfigFromEnv();
  console.log(`Restoring ${archive} into the ${describeDatabase(databaseUrl)} and ${describeBucket(bucket)}${profile ? ` (profile ${profile})` : ''}`);
  const result = await restoreBackup({ archive, databaseUrl, bucket, replace: args.replace || args.force, log: (line) => console.log(line) });

  console.log('Photo storage check …');
  const { Kysely, PostgresDialect } = await import('kysely');
  const { pg } = await import('@/db/pg-types');
  const { checkRestoredPhotos } = await import('@/docker-free-scripts/backup/photo-check');
  const db = new Kysely<import('@/db/schema.gen').DB>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: databaseUrl, max: 2 }) }) });
  try {
    const check = await checkRestoredPhotos(db, result.manifest);
    const r = check.report;
    console.log(`  ${r.photoCount} photo records, ${r.objectCount} photo objects`);
    if (check.carriedOver) console.log(`  ${check.carriedOver} problem(s) the backup already held (see its manifest); \`npm run photos:check -- --repair\` fixes them`);
    if (check.unexpected.length) {
      code = 1;
      console.error('The restored photos differ from the backup:');
      for (const u of check.unexpected.slice(0, 50)) console.error(`  ${u}`);
    } else {
      console.log(`Restored: the photo storage matches the backup.`);
    }
  } finally {
    await db.destroy();
  }
} catch (error) {
  code = error instanceof RestoreRefused ? 2 : 1;
  console.error(`${code === 2 ? '' : 'restore failed: '}${error instanceof Error ? error.message : String(error)}`);
} finally {
  await services?.stop();
}
process.exit(code);
