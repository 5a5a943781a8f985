// npm run photos:check: the photo storage check of Settings → Storage, for every company, from a
// shell. Lists photo objects that no record refers to and records whose objects are missing.
//
//   npm run photos:check                          report only
//   npm run photos:check -- --repair              also repair (see below), then report again
//   npm run photos:check -- --grace-minutes 0     treat even brand-new objects as leftovers
//   npm run photos:check -- --json                print the report as JSON
//
// Repair: deletes leftover objects older than the grace period (15 minutes by default, so an
// upload that is between writing its files and its record is never touched); makes missing
// display copies and thumbnails again from the original; rebuilds a lost original from the
// display copy; removes a record whose image is gone entirely (with an audit event).
// Reads the app's environment (DATABASE_URL, S3_*, AUTH_SECRET; `source docker-free-scripts/env.sh
// dev` sets them for the local setup). Exit status: 0 when storage is consistent afterwards,
// 1 when problems remain, 2 when the check could not run.
import '@/docker-free-scripts/server-modules';
import { parseArgs } from 'node:util';

const { values: args } = parseArgs({
  options: {
    repair: { type: 'boolean', default: false },
    json: { type: 'boolean', default: false },
    'grace-minutes': { type: 'string' },
    help: { type: 'boolean', short: 'h', default: false },
  },
});

if (args.help) {
  console.log('Usage: npm run photos:check [-- --repair] [--grace-minutes N] [--json]');
  process.exit(0);
}

const graceMinutes = args['grace-minutes'] === undefined ? 15 : Number(args['grace-minutes']);
if (!Number.isFinite(graceMinutes) || graceMinutes < 0) {
  console.error('photos:check: --grace-minutes needs a number of minutes (0 or more).');
  process.exit(2);
}

const { db } = await import('@/db');
const { inspectPhotoStorage, repairPhotoStorage } = await import('@/lib/photos/consistency');
const { formatBytes } = await import('@/lib/photos/schemas');
type Report = Awaited<ReturnType<typeof inspectPhotoStorage>>;

function print(report: Report): void {
  console.log(`Photo records: ${report.photoCount}; photo objects: ${report.objectCount} (${formatBytes(report.objectBytes)}).`);
  console.log(`Objects with no record (older than ${report.graceMinutes} min): ${report.orphanObjects.length} (${formatBytes(report.orphanBytes)})`);
  for (const o of report.orphanObjects.slice(0, 50)) console.log(`  ${o.key}  ${formatBytes(o.size)}  ${o.lastModified ?? ''}`);
  if (report.orphanObjects.length > 50) console.log(`  … and ${report.orphanObjects.length - 50} more`);
  if (report.recentObjects.length) console.log(`Recent objects with no record yet (uploads in progress, left alone): ${report.recentObjects.length}`);
  console.log(`Records with missing objects: ${report.missing.length}`);
  for (const m of report.missing) console.log(`  photo ${m.photoId} (${m.kind}, ${m.equipmentName ?? 'unknown equipment'}): missing ${m.missing.join(', ')} → ${m.repair.replace('_', ' ')}`);
}

let exitCode = 0;
try {
  const graceMs = graceMinutes * 60_000;
  if (args.repair) {
    const result = await repairPhotoStorage(db, null, null, new Date(), graceMs);
    if (args.json) console.log(JSON.stringify(result, null, 2));
    else {
      console.log(
        `Repaired: ${result.deletedObjects} leftover object(s) deleted, ${result.regenerated} photo(s) given new small copies, ` +
          `${result.restored} original(s) rebuilt from the display copy, ${result.removedRecords} record(s) with no image removed.`,
      );
      for (const f of result.failures) console.log(`  failed: ${f}`);
      console.log('After the repair:');
      print(result.report);
    }
    if (result.failures.length || result.report.orphanObjects.length || result.report.missing.length) exitCode = 1;
  } else {
    const report = await inspectPhotoStorage(db, null, new Date(), graceMs);
    if (args.json) console.log(JSON.stringify(report, null, 2));
    else print(report);
    if (report.orphanObjects.length || report.missing.length) {
      exitCode = 1;
      if (!args.json) console.log('Run `npm run photos:check -- --repair` to fix these.');
    } else if (!args.json) {
      console.log('Photo storage is consistent.');
    }
  }
} catch (error) {
  console.error(`photos:check could not run: ${error instanceof Error ? error.message : String(error)}`);
  exitCode = 2;
} finally {
  await db.destroy();
}
process.exit(exitCode);
