import { ArrowRight, Ban, CircleDashed, ScanLine } from 'lucide-react';
import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { TagStateBadge } from '@/components/tags/tag-state-badge';
import { orNotFound } from '@/lib/api/page';
import { requirePageActor } from '@/lib/auth';
import { listEquipment } from '@/lib/equipment/service';
import { listAreas } from '@/lib/sites/service';
import { codeFromPathSegment, formatCode } from '@/lib/tags/code';
import { retireReasonLabels } from '@/lib/tags/schemas';
import { resolveTag, siteTagCodes } from '@/lib/tags/service';
import { ClaimFlow } from '@/app/(app)/scan/[code]/_components/claim-flow';
import { formatDay } from '@/lib/format/dates';
import { TagCode } from '@/components/tags/tag-code';

export const metadata: Metadata = { title: 'Tag' };

function formatWhen(iso: string | null): string {
  if (!iso) return 'an unknown date';
  return formatDay(iso);
}

/** What a scanned tag opens when it is not simply equipment: the claim flow, or a retired tag's story. */
export default async function TagStatePage({ params }: { params: Promise<{ code: string }> }) {
  const code = codeFromPathSegment((await params).code);
  if (!code) notFound();
  const actor = await requirePageActor(`/scan/${code}`, 'tags.scan');
  const resolution = await orNotFound(resolveTag(actor, code));
  if (resolution.state === 'attached') redirect(resolution.target);
  const { tag } = resolution;
  const display = formatCode(tag.code);

  if (resolution.state === 'retired') {
    return (
      <>
        <PageHeader title={`Tag ${display}`} subtitle={<TagStateBadge state="retired" />} />
        <div className="max-w-2xl space-y-4">
          <Alert tone="info" title={`This tag was retired on ${formatWhen(tag.retiredAt)}.`}>
            <p>
              Why: {tag.retiredReason ? retireReasonLabels[tag.retiredReason] : 'not recorded'}
              {tag.replacedByCode ? ` (new tag ${formatCode(tag.replacedByCode)})` : ''}.
            </p>
            {tag.retiredNote ? <p className="mt-1 whitespace-pre-line">{tag.retiredNote}</p> : null}
          </Alert>
          {resolution.equipment ? (
            <div className="space-y-3 rounded-lg border border-slate-200 bg-white p-4">
              <p className="text-slate-800">
                It was on <strong>{resolution.equipment.name}</strong>
                {resolution.currentCode ? (
                  <>
                    , which now carries tag <TagCode code={resolution.currentCode} className="font-bold" />.
                  </>
                ) : (
                  ', which has no tag at the moment.'
                )}
              </p>
              <ButtonLink href={`/equipment/${resolution.equipment.id}`} size="lg" className="min-h-14 w-full text-lg sm:w-auto">
                Open {resolution.equipment.name} <ArrowRight aria-hidden className="size-5" />
              </ButtonLink>
            </div>
          ) : (
            <p className="flex items-center gap-2 text-slate-700">
              <Ban aria-hidden className="size-5" /> It was never put on equipment.
            </p>
          )}
          <ButtonLink href="/scan" variant="secondary" size="lg" className="min-h-14">
            <ScanLine aria-hidden className="size-5" /> Scan another tag
          </ButtonLink>
        </div>
      </>
    );
  }

  // Blank: the claim flow for staff; others only learn it is not on equipment yet.
  if (!resolution.canClaim || !tag.siteId) {
    return (
      <>
        <PageHeader title={`Tag ${display}`} subtitle={<TagStateBadge state="blank" />} />
        <p className="flex max-w-2xl items-center gap-2 text-slate-700">
          <CircleDashed aria-hidden className="size-5" /> This tag has not been put on any equipment yet.
        </p>
      </>
    );
  }
  const [equipment, areas, codes] = await Promise.all([
    listEquipment(actor, { siteId: tag.siteId, limit: 200, sort: 'name', dir: 'asc' }),
    listAreas(actor, tag.siteId),
    siteTagCodes(actor, tag.siteId),
  ]);
  return (
    <>
      <PageHeader
        title={`Attach tag ${display}`}
        subtitle={
          <span className="flex flex-wrap items-center gap-2">
            <TagStateBadge state="blank" /> Printed for {tag.siteName}. Choose the unit it goes on.
          </span>
        }
      />
      <ClaimFlow
        code={tag.code}
        siteName={tag.siteName ?? 'this site'}
        equipment={equipment.items.map((e) => ({ id: e.id, name: e.name, type: e.type, areaName: e.areaName, tagCode: codes[e.id] ?? null }))}
        areas={areas.filter((a) => !a.archivedAt).map((a) => ({ id: a.id, name: a.name }))}
        canCreate={resolution.canCreateEquipment}
      />
    </>
  );
}
