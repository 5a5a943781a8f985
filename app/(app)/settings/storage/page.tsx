import type { Metadata } from 'next';
import Link from 'next/link';
import { Alert } from '@/components/ui/alert';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { isAppError } from '@/lib/errors';
import type { StorageReportDto } from '@/lib/photos/dto';
import { formatBytes, photoKindLabels } from '@/lib/photos/schemas';
import { checkPhotoStorage } from '@/lib/photos/files';
import { formatStamp } from '@/lib/format/dates';
import { RepairStorageButton } from '@/app/(app)/settings/storage/_components/repair-storage-button';

export const metadata: Metadata = { title: 'Photo storage' };
// The check reads the live store on every visit.
export const dynamic = 'force-dynamic';

const repairWords = {
  regenerate: 'Make the display copy and thumbnail again from the original',
  restore_original: 'Rebuild the original from the display copy (the camera file is lost)',
  remove_record: 'Remove the record: no image file is left',
} as const;

function when(iso: string | null): string {
  return iso ? formatStamp(iso) : 'unknown time';
}

export default async function StorageSettingsPage() {
  const actor = await requirePageActor('/settings/storage', 'photos.maintain');
  let report: StorageReportDto | null = null;
  let failure: string | null = null;
  try {
    report = await checkPhotoStorage(actor);
  } catch (error) {
    if (!isAppError(error)) throw error;
    failure = error.message;
  }

  return (
    <>
      <PageHeader
        title="Photo storage"
        subtitle="Compares the photo records with the files in object storage: files no record uses, and records whose files are missing."
      />
      {failure || !report ? (
        <Alert tone="danger" title="The check could not run.">
          {failure}
        </Alert>
      ) : (
        <div className="space-y-4">
          {report.orphanObjects.length === 0 && report.missing.length === 0 ? (
            <Alert tone="success" title="Photo storage is consistent.">
              Every record has its files and every file belongs to a record.
            </Alert>
          ) : (
            <Alert tone="warning" title="The check found problems.">
              {[
                report.orphanObjects.length ? `${report.orphanObjects.length} file(s) with no record` : null,
                report.missing.length ? `${report.missing.length} record(s) with missing files` : null,
              ]
                .filter(Boolean)
                .join(' and ')}
              . Repair fixes {report.orphanObjects.length && report.missing.length ? 'both' : 'this'}; details below.
            </Alert>
          )}
          <Card>
            <dl className="grid gap-3 sm:grid-cols-3">
              <div>
                <dt className="text-sm text-slate-600">Photo records</dt>
                <dd className="text-2xl font-bold">{report.photoCount}</dd>
              </div>
              <div>
                <dt className="text-sm text-slate-600">Photo files</dt>
                <dd className="text-2xl font-bold">
                  {report.objectCount} <span className="text-base font-normal text-slate-700">({formatBytes(report.objectBytes)})</span>
                </dd>
              </div>
              <div>
                <dt className="text-sm text-slate-600">Checked</dt>
                <dd className="font-semibold">{when(report.checkedAt)}</dd>
              </div>
            </dl>
          </Card>

          <section aria-labelledby="orphans-h" className="space-y-2">
            <h2 id="orphans-h" className="text-lg font-semibold">
              Files with no record ({report.orphanObjects.length}, {formatBytes(report.orphanBytes)})
            </h2>
            <p className="text-sm text-slate-700">
              Left behind by an upload or a delete that was interrupted. Repair deletes them. Files younger than {report.graceMinutes} minutes may
              belong to an upload in progress and are never touched{report.recentObjects.length ? ` (${report.recentObjects.length} right now)` : ''}.
            </p>
            {report.orphanObjects.length ? (
              <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white text-sm">
                {report.orphanObjects.slice(0, 100).map((o) => (
                  <li key={o.key} className="flex flex-col gap-0.5 p-3 sm:flex-row sm:justify-between">
                    <span className="break-all font-mono text-xs text-slate-800">{o.key}</span>
                    <span className="shrink-0 text-slate-700">
                      {formatBytes(o.size)} · {when(o.lastModified)}
                    </span>
                  </li>
                ))}
                {report.orphanObjects.length > 100 ? <li className="p-3 text-slate-700">… and {report.orphanObjects.length - 100} more</li> : null}
              </ul>
            ) : null}
          </section>

          <section aria-labelledby="missing-h" className="space-y-2">
            <h2 id="missing-h" className="text-lg font-semibold">
              Records with missing files ({report.missing.length})
            </h2>
            {report.missing.length ? (
              <ul className="divide-y divide-slate-100 rounded-lg border border-slate-200 bg-white text-sm">
                {report.missing.map((m) => (
                  <li key={m.photoId} className="space-y-0.5 p-3">
                    <p className="font-semibold">
                      {photoKindLabels[m.kind]} photo of{' '}
                      <Link className="text-ice-800 underline" href={`/equipment/${m.equipmentId}`}>
                        {m.equipmentName ?? 'equipment'}
                      </Link>
                      , uploaded {when(m.uploadedAt)}
                    </p>
                    <p className="text-slate-700">Missing: {m.missing.join(', ')}</p>
                    <p className="text-slate-700">Repair: {repairWords[m.repair]}</p>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-sm text-slate-700">None.</p>
            )}
          </section>

          <RepairStorageButton disabled={report.orphanObjects.length === 0 && report.missing.length === 0} />
          <p className="text-sm text-slate-600">
            The same check runs from a shell with <code className="font-mono">npm run photos:check</code> (add <code className="font-mono">-- --repair</code> to fix).
          </p>
        </div>
      )}
    </>
  );
}
