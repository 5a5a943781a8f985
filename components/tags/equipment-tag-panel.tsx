import { History, Printer, QrCode, ScanLine } from 'lucide-react';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { TagCode } from '@/components/tags/tag-code';
import { TagStateBadge } from '@/components/tags/tag-state-badge';
import { TagActions } from '@/components/tags/tag-actions';
import type { EquipmentTagInfoDto } from '@/lib/tags/dto';
import { retireReasonLabels } from '@/lib/tags/schemas';
import { formatMoment } from '@/lib/format/moments';

const viaWords = { link: 'phone camera link', camera: 'Scan page', typed: 'typed code' } as const;

function when(iso: string, timeZone: string): string {
  return formatMoment(iso, timeZone);
}

/**
 * The equipment page's tag box: the tag on the unit, when it was last scanned, earlier tags, and
 * "Replace tag" when the service's flags allow it. The page fetches `info` (getEquipmentTagInfo).
 */
export function EquipmentTagPanel({ info }: { info: EquipmentTagInfoDto }) {
  const { equipmentId } = info;
  const tz = info.timeZone;
  return (
    <Card aria-labelledby="tag-h" role="region" data-testid="equipment-tag-panel">
      <h2 id="tag-h" className="flex items-center gap-2 text-lg font-semibold">
        <QrCode aria-hidden className="size-5" /> Tag
      </h2>
      {info.current ? (
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <TagCode code={info.current.code} className="text-2xl font-bold tracking-widest" data-testid="current-tag-code" />
          <TagStateBadge state="attached" />
          {info.current.attachedAt ? (
            <span className="text-sm text-slate-600">
              since {when(info.current.attachedAt, tz)}
              {info.current.attachedByName ? ` (${info.current.attachedByName})` : ''}
            </span>
          ) : null}
        </div>
      ) : (
        <p className="mt-2 text-slate-700">No tag on this unit.</p>
      )}
      <p className="mt-3 flex items-center gap-2 text-sm text-slate-700" data-testid="last-scanned">
        <ScanLine aria-hidden className="size-4" />
        {info.lastScan ? (
          <span>
            Last scanned {when(info.lastScan.at, tz)} by {info.lastScan.byName} ({viaWords[info.lastScan.via]}, tag <TagCode code={info.lastScan.code} className="font-normal" />) ·{' '}
            {info.scanCount} {info.scanCount === 1 ? 'scan' : 'scans'} in all
          </span>
        ) : (
          <span>Never scanned.</span>
        )}
      </p>
      {info.previous.length > 0 ? (
        <details className="mt-3">
          <summary className="flex min-h-11 cursor-pointer items-center gap-2 text-sm font-semibold text-slate-800">
            <History aria-hidden className="size-4" /> Earlier tags ({info.previous.length})
          </summary>
          <ul className="mt-1 space-y-1 text-sm text-slate-700">
            {info.previous.map((t) => (
              <li key={t.id} className="flex flex-wrap items-center gap-2">
                <TagCode code={t.code} />
                <TagStateBadge state={t.state} />
                {t.retiredAt ? `${when(t.retiredAt, tz)}: ` : ''}
                {t.retiredReason ? retireReasonLabels[t.retiredReason] : ''}
                {t.replacedByCode ? (
                  <>
                    {' '}by <TagCode code={t.replacedByCode} className="font-normal" />
                  </>
                ) : null}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
      {info.canAttach ? (
        <div className="mt-4 space-y-2">
          <TagActions equipmentId={equipmentId} currentCode={info.current?.code ?? null} />
          {info.canPrint ? (
            <Link href={`/tags/new?equipment=${equipmentId}`} className="inline-flex min-h-11 items-center gap-2 text-sm font-semibold text-ice-800 underline">
              <Printer aria-hidden className="size-4" /> Print a new tag for this unit
            </Link>
          ) : null}
        </div>
      ) : null}
    </Card>
  );
}
