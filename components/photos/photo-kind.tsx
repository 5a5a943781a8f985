import { Bandage, Cable, Camera, ClipboardCheck, ClipboardList, Droplets, Tag, type LucideIcon } from 'lucide-react';
import { photoKindLabels, type PhotoKind } from '@/lib/photos/terms';
import { cn } from '@/lib/utils';
import { formatDay, formatStamp, localDate } from '@/lib/format/dates';

// A photo's kind is shown as a word with an icon, never as a colour alone.
export const photoKindIcons: Record<PhotoKind, LucideIcon> = {
  nameplate: Tag,
  damage: Bandage,
  corrosion: Droplets,
  wiring: Cable,
  before: ClipboardList,
  after: ClipboardCheck,
  general: Camera,
};

export function PhotoKindLabel({ kind, className }: { kind: PhotoKind; className?: string }) {
  const Icon = photoKindIcons[kind];
  return (
    <span className={cn('inline-flex items-center gap-1 font-semibold', className)}>
      <Icon aria-hidden className="size-4 shrink-0" />
      {photoKindLabels[kind]}
    </span>
  );
}

/** A day as the site sees it: "Jun 14, 2024". */
export function formatPhotoDay(iso: string, timeZone: string): string {
  return formatDay(iso, timeZone);
}

export function formatPhotoTime(iso: string, timeZone: string): string {
  return formatStamp(iso, timeZone);
}

/** Calendar day in the site's zone, for "same day?" comparisons. */
export function photoDayKey(iso: string, timeZone: string): string {
  return localDate(new Date(iso), timeZone);
}

/** "2 years 5 months apart", "3 weeks apart", "the same day". */
export function timeApart(a: string, b: string, timeZone: string): string {
  if (photoDayKey(a, timeZone) === photoDayKey(b, timeZone)) return 'the same day';
  const ms = Math.abs(new Date(b).getTime() - new Date(a).getTime());
  const days = Math.max(1, Math.round(ms / 86_400_000));
  const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;
  if (days < 14) return `${plural(days, 'day')} apart`;
  if (days < 61) return `${plural(Math.round(days / 7), 'week')} apart`;
  const months = Math.round(days / 30.44);
  if (months < 12) return `${plural(months, 'month')} apart`;
  const years = Math.floor(months / 12);
  const rest = months % 12;
  return `${plural(years, 'year')}${rest ? ` ${plural(rest, 'month')}` : ''} apart`;
}
