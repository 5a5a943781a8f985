import { CircleCheck, CircleX, TriangleAlert, type LucideIcon } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { SeverityBadge } from '@/components/visits/badges';
import type { UnitPrefs } from '@/lib/units/quantities';
import type { EntryDto } from '@/lib/visits/dto';
import { describeEntry } from '@/lib/visits/report-content';
import { leakResultLabels, type LeakResult as LeakWorkOutcome, type Severity } from '@/lib/visits/schemas';
import { formatDay } from '@/lib/format/dates';
import { formatLeakRate } from '@/lib/format/numbers';

interface LeakResult {
  ratePct?: number;
  thresholdPct?: number;
  exceedsThreshold?: boolean;
  regulated?: boolean;
  repairDueDate?: string | null;
  basis?: string;
  cautions?: string[];
}

/** The shared one-line description starts with the kind, which is shown beside it: drop only that. */
const kindPrefixes: Partial<Record<EntryDto['kind'], string>> = {
  reading: 'Readings: ',
  action: 'Action: ',
  part: 'Part replaced: ',
  note: 'Note: ',
  photo: 'Photo: ',
  refrigerant: 'Refrigerant ',
};

function withoutKindPrefix(kind: EntryDto['kind'], text: string): string {
  const prefix = kindPrefixes[kind];
  if (!prefix || !text.startsWith(prefix)) return text;
  const rest = text.slice(prefix.length);
  return rest.charAt(0).toUpperCase() + rest.slice(1);
}


/** The leak rate the server worked out on an addition, with the repair deadline when it is over the threshold. */
export function LeakRateNotice({ computed }: { computed: Record<string, unknown> | null }) {
  const leak = (computed?.leak ?? null) as LeakResult | null;
  const problems = Array.isArray(computed?.problems) ? (computed.problems as string[]) : [];
  if (!leak) {
    return problems.length ? (
      <Alert tone="info" title="Leak rate not computed" className="mt-2">
        {problems.join(' ')}
      </Alert>
    ) : null;
  }
  const rate = typeof leak.ratePct === 'number' ? formatLeakRate(leak.ratePct) : '—';
  if (leak.exceedsThreshold) {
    return (
      <Alert tone="danger" title={`Leak rate ${rate}: over the ${leak.thresholdPct} % threshold`} className="mt-2">
        {leak.repairDueDate ? (
          <p>
            Repair due by <strong data-testid="leak-repair-due">{formatDay(leak.repairDueDate)}</strong>, then the verification tests.
          </p>
        ) : (
          <p>Above the threshold for this application; no regime covers this appliance on this date, so no legal deadline is set.</p>
        )}
        {leak.basis ? <p className="mt-1 text-xs">How this is worked out: {leak.basis}</p> : null}
      </Alert>
    );
  }
  return (
    <Alert tone="info" title={`Leak rate ${rate}: within the ${leak.thresholdPct} % threshold`} className="mt-2">
      {leak.basis ? <p className="text-xs">How this is worked out: {leak.basis}</p> : null}
    </Alert>
  );
}

const leakResultLooks: Partial<Record<LeakWorkOutcome, { Icon: LucideIcon; box: string }>> = {
  leak_found: { Icon: TriangleAlert, box: 'border-amber-400 bg-amber-50 text-amber-950' },
  no_leak_found: { Icon: CircleCheck, box: 'border-emerald-300 bg-emerald-50 text-emerald-950' },
  passed: { Icon: CircleCheck, box: 'border-emerald-300 bg-emerald-50 text-emerald-950' },
  failed: { Icon: CircleX, box: 'border-red-400 bg-red-50 text-red-950' },
};

/** The outcome of a leak inspection or verification test as a word with an icon, never colour alone. */
function LeakWorkResult({ data }: { data: Record<string, unknown> }) {
  const look = leakResultLooks[data.result as LeakWorkOutcome];
  if (!look) return null;
  return (
    <p>
      <span className={`inline-flex items-center gap-1.5 rounded-full border px-2 py-0.5 text-sm font-semibold ${look.box}`}>
        <look.Icon aria-hidden className="size-4" />
        <span className="sr-only">Result: </span>
        {leakResultLabels[data.result as LeakWorkOutcome]}
      </span>
    </p>
  );
}

/** One entry in words, in the viewer's units; the same sentence the visit report uses. */
/** An entry to describe; `computed` is undefined while the entry is still on the phone (the server has not worked it out yet). */
export interface SummaryEntry {
  kind: EntryDto['kind'];
  data: Record<string, unknown>;
  computed?: Record<string, unknown> | null;
}

export function EntrySummary({ entry, prefs }: { entry: SummaryEntry; prefs: UnitPrefs }) {
  let text = withoutKindPrefix(entry.kind, describeEntry({ ...entry, computed: entry.computed ?? null } as EntryDto, prefs));
  // The leak rate gets its own notice below; the report's one-line form of it would repeat it.
  if (entry.kind === 'refrigerant') text = text.split('; leak rate')[0]!;
  const d = entry.data;
  return (
    <div className="min-w-0 space-y-1">
      {entry.kind === 'finding' ? (
        <p className="flex flex-wrap items-center gap-2">
          <SeverityBadge severity={d.severity as Severity} />
          {d.raiseFollowUp ? <span className="text-sm font-medium text-slate-700">Follow-up raised</span> : null}
        </p>
      ) : null}
      {entry.kind === 'photo' && typeof d.photoId === 'string' ? (
        // A plain img: the bytes come through the access-checked API, not an image optimiser.
        <img src={`/api/photos/${d.photoId}/thumb`} alt={typeof d.caption === 'string' ? d.caption : 'Photo'} className="h-24 w-auto rounded border border-slate-300" loading="lazy" />
      ) : null}
      {entry.kind === 'photo' && !d.caption ? null : <p className="break-words text-slate-900">{entry.kind === 'finding' ? String(d.text ?? '') : text}</p>}
      {entry.kind === 'refrigerant' && d.direction === 'added' && entry.computed !== undefined ? <LeakRateNotice computed={entry.computed} /> : null}
      {entry.kind === 'leak' ? <LeakWorkResult data={d} /> : null}
    </div>
  );
}
