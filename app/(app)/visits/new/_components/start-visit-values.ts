import { TZDate } from '@date-fns/tz';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { startVisitSchema, type VisitReason } from '@/lib/visits/schemas';

// The start-visit form's values and their check, apart from the form so they can be tested alone.

/** "07:30" today in the site's time zone → an instant; null for no time, a bad one or one still to come. */
export function todayAt(hhmm: string, timeZone: string): string | null {
  const m = /^(\d{1,2}):(\d{2})$/.exec(hhmm);
  if (!m) return null;
  const now = new TZDate(Date.now(), timeZone);
  const at = new TZDate(now.getFullYear(), now.getMonth(), now.getDate(), Number(m[1]), Number(m[2]), 0, timeZone);
  if (at.getTime() > Date.now()) return null;
  return new Date(at.getTime()).toISOString();
}

export interface StartValues {
  reason: VisitReason | '';
  when: 'now' | 'earlier';
  /** As typed in the time field, site time. */
  time: string;
}

/** The visit's start checked by the API's own schema; an arrival time it cannot take is said on the time field. */
export function startResolver(siteId: string, timeZone: string) {
  return schemaResolver(
    startVisitSchema,
    (v: StartValues) => ({ siteId, reason: v.reason || undefined, startedAt: v.when === 'earlier' ? todayAt(v.time, timeZone) : undefined }),
    {
      adjust: (errors) => {
        if (!errors.startedAt) return;
        errors.time = { type: 'custom', message: 'Give a time earlier today, like 07:30.' };
        delete errors.startedAt;
      },
    },
  );
}
