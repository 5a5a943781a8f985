import { Archive, BellRing, ClipboardList, ClipboardPen, QrCode } from 'lucide-react';
import Link from 'next/link';
import { ConditionBadge } from '@/components/equipment/condition-badge';
import { EquipmentTypeIcon } from '@/components/equipment/equipment-type-icon';
import { EquipmentStatusBadge } from '@/components/equipment/status-badge';
import { QuickPhotoButton } from '@/components/photos/quick-photo';
import { ButtonLink } from '@/components/ui/button';
import { currentSettings, type SettingLine } from '@/lib/equipment/current-settings';
import type { EquipmentDetailDto, UnitFactsDto } from '@/lib/equipment/dto';
import { equipmentTypeLabels } from '@/lib/equipment/types';
import { formatDay } from '@/lib/format/dates';
import { formatCode } from '@/lib/tags/code';
import type { UnitPrefs } from '@/lib/units/quantities';

/** A removed unit says so first, with the unit that took its place. */
export function RemovedNotice({ equipment }: { equipment: Pick<EquipmentDetailDto, 'removedAt' | 'replacedById' | 'replacedByName' | 'siteTimeZone'> }) {
  return (
    <div role="status" className="flex items-start gap-2 rounded-md border-2 border-slate-400 bg-slate-100 p-3 text-slate-900" data-testid="removed-notice">
      <Archive aria-hidden className="mt-0.5 size-5 shrink-0" />
      <p>
        <strong>Removed{equipment.removedAt ? ` on ${formatDay(equipment.removedAt, equipment.siteTimeZone)}` : ''}</strong>
        {equipment.replacedById ? (
          <>
            , replaced by{' '}
            <Link href={`/equipment/${equipment.replacedById}`} className="font-semibold text-ice-800 underline">
              {equipment.replacedByName}
            </Link>
            .
          </>
        ) : (
          '. Its history is kept here.'
        )}
      </p>
    </div>
  );
}

/** A control's current settings as a small grid: one row per side, one column per setting. */
function SettingsTable({ lines }: { lines: SettingLine[] }) {
  const columns = [...new Set(lines.flatMap((l) => l.values.map((v) => v.label)))];
  return (
    <table className="w-full rounded-md sm:w-auto border border-slate-200 bg-slate-50 text-sm" data-testid="current-settings">
      <caption className="sr-only">Current settings</caption>
      <thead>
        <tr className="text-left text-xs text-slate-600">
          <td className="px-2 pt-1" />
          {columns.map((c) => (
            <th key={c} scope="col" className="px-2 pt-1 font-semibold">
              {c}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {lines.map((line) => (
          <tr key={line.side}>
            <th scope="row" className="px-2 py-0.5 text-left font-semibold text-slate-800">
              {line.side}
            </th>
            {columns.map((c) => (
              <td key={c} className="whitespace-nowrap px-2 py-0.5 font-semibold text-slate-900">
                {line.values.find((v) => v.label === c)?.text ?? '—'}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/**
 * The top of the unit page, sized for a phone's first screen: what and where it is, how it is, its
 * tag, when it was last seen to, its control settings, and the one or two things the viewer does next.
 */
export function UnitHeader({ equipment, facts, prefs }: { equipment: EquipmentDetailDto; facts: UnitFactsDto; prefs: UnitPrefs }) {
  const removed = equipment.status === 'removed';
  const settings = currentSettings(equipment.type, equipment.nameplate, prefs);
  const followUpWord = facts.openFollowUps === 1 ? 'open follow-up' : 'open follow-ups';
  return (
    <header className="space-y-2">
      {removed ? <RemovedNotice equipment={equipment} /> : null}
      {/* One column on a phone; on a wide screen the settings and actions stand to the right, so the history starts higher. */}
      <div className="space-y-2 lg:flex lg:items-start lg:justify-between lg:gap-8 lg:space-y-0">
        <div className="min-w-0 space-y-2">
          <h1 className="break-words text-xl font-bold leading-tight tracking-tight text-slate-900 sm:text-2xl">{equipment.name}</h1>
          <p className="text-sm text-slate-700">
            <span className="inline-flex items-center gap-1 font-semibold text-slate-800">
              <EquipmentTypeIcon type={equipment.type} className="size-4" />
              {equipmentTypeLabels[equipment.type]}
            </span>
            {' · '}
            <Link href={`/sites/${equipment.siteId}`} className="font-medium text-ice-800 underline">
              {equipment.siteName}
            </Link>
            {equipment.areaName ? ` · ${equipment.areaName}` : ''}
          </p>
          <div className="flex flex-wrap items-center gap-1.5">
            <ConditionBadge condition={equipment.condition} />
            <EquipmentStatusBadge status={equipment.status} />
          </div>
          <p className="text-sm text-slate-700" data-testid="unit-facts">
            {facts.tagCode ? (
              <span className="whitespace-nowrap" data-testid="header-tag-code">
                <QrCode aria-hidden className="mr-1 inline size-4 align-[-3px]" />
                Tag <span className="font-mono font-semibold tracking-wider text-slate-900">{formatCode(facts.tagCode)}</span>
                {' · '}
              </span>
            ) : null}
            {facts.lastVisit ? (
              <span className="whitespace-nowrap">
                Last visit{' '}
                <Link href={`/visits/${facts.lastVisit.id}`} className="font-semibold text-ice-800 underline">
                  {formatDay(facts.lastVisit.startedAt, facts.lastVisit.timeZone)}
                </Link>
              </span>
            ) : (
              'No visit recorded yet'
            )}
            {' · '}
            {facts.openFollowUps > 0 ? (
              <Link href={`/follow-ups?siteId=${equipment.siteId}`} className="whitespace-nowrap font-semibold text-ice-800 underline">
                {facts.openFollowUps} {followUpWord}
              </Link>
            ) : (
              <span className="whitespace-nowrap">no open follow-ups</span>
            )}
          </p>
        </div>
        <div className="space-y-2 lg:shrink-0">
          {settings.length > 0 ? <SettingsTable lines={settings} /> : null}
          {/* The main actions for this viewer; other tools (a photo shortcut) add their buttons here. */}
          <div data-slot="unit-actions" className="flex flex-wrap gap-2 pt-1 lg:justify-end">
            {equipment.canStartVisit ? (
              facts.openVisitId ? (
                <ButtonLink href={`/visits/${facts.openVisitId}?equipment=${equipment.id}`} size="lg">
                  <ClipboardPen aria-hidden className="size-5" /> Continue visit
                </ButtonLink>
              ) : (
                <ButtonLink href={`/visits/new?siteId=${equipment.siteId}&equipmentId=${equipment.id}`} size="lg">
                  <ClipboardList aria-hidden className="size-5" /> Log a visit<span className="sr-only"> on this unit</span>
                </ButtonLink>
              )
            ) : null}
            <QuickPhotoButton equipmentId={equipment.id} canUpload={equipment.canUploadPhoto} />
            {equipment.canAskForService ? (
              // Where a scan lands an owner: what to do when the unit is not right.
              <ButtonLink href={`/requests/new?siteId=${equipment.siteId}&equipmentId=${equipment.id}`} size="lg">
                <BellRing aria-hidden className="size-5" /> Ask for service
              </ButtonLink>
            ) : null}
          </div>
        </div>
      </div>
    </header>
  );
}
