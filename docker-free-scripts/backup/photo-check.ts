// After a restore: the photo storage check (the one behind `npm run photos:check`), compared with
// what the backup's manifest already listed. Problems the backup held come back as they were;
// anything else means the restore went wrong. Needs the app's server modules, so the caller loads
// docker-free-scripts/server-modules first and points DATABASE_URL and S3_* at the target.
import type { Kysely } from 'kysely';
import type { DB } from '@/db/schema.gen';
import type { BackupManifest } from '@/lib/ops/backup-manifest';
import { isPhotoObjectKey } from '@/lib/photos/compare';
import type { StorageReportDto } from '@/lib/photos/dto';

export interface RestoredPhotoCheck {
  report: StorageReportDto;
  /** Problems the manifest listed, found again. */
  carriedOver: number;
  /** Problems the manifest did not list (or listed problems that vanished): the restore is wrong. */
  unexpected: string[];
}

export async function checkRestoredPhotos(db: Kysely<DB>, manifest: BackupManifest): Promise<RestoredPhotoCheck> {
  const { inspectPhotoStorage } = await import('@/lib/photos/consistency');
  // Grace 0: nothing uploads into a profile that was just restored, and every object is new to it.
  const report = await inspectPhotoStorage(db, null, new Date(), 0);
  const expectedOrphans = new Set(manifest.problems.orphanObjects.filter(isPhotoObjectKey));
  const expectedMissing = new Set(manifest.problems.missingObjects.filter((m) => m.table === 'photos').map((m) => m.id));
  const foundOrphans = new Set(report.orphanObjects.map((o) => o.key));
  const foundMissing = new Set(report.missing.map((m) => m.photoId));
  const unexpected = [
    ...[...foundOrphans].filter((k) => !expectedOrphans.has(k)).map((k) => `object ${k} has no photo record`),
    ...[...expectedOrphans].filter((k) => !foundOrphans.has(k)).map((k) => `leftover object ${k} of the backup was not put back`),
    ...[...foundMissing].filter((id) => !expectedMissing.has(id)).map((id) => `photo ${id} lacks objects it had in the backup`),
    ...[...expectedMissing].filter((id) => !foundMissing.has(id)).map((id) => `photo ${id}, listed as missing objects, is not`),
  ];
  const carriedOver = [...foundOrphans].filter((k) => expectedOrphans.has(k)).length + [...foundMissing].filter((id) => expectedMissing.has(id)).length;
  return { report, carriedOver, unexpected };
}
