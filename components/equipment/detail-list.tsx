import type { ReactNode } from 'react';

// A unit's recorded facts (details, nameplate), online on its page and offline in the phone's kept
// copy: one label/value row each, beside each other where there is room.
function Detail({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 py-2 sm:flex-row sm:gap-4 lg:flex-col lg:gap-0.5 xl:flex-row xl:gap-4">
      <dt className="text-sm font-medium text-slate-600 sm:w-44 sm:shrink-0">{label}</dt>
      <dd className="min-w-0 break-words font-medium text-slate-900">{children}</dd>
    </div>
  );
}

/** Recorded values as a list; the rest named in one line, so a phone does not scroll past blanks. */
export function DetailList({ rows }: { rows: { label: string; value: ReactNode }[] }) {
  const recorded = rows.filter((r) => r.value !== null && r.value !== undefined && r.value !== '');
  const missing = rows.filter((r) => !recorded.includes(r)).map((r) => r.label);
  return (
    <>
      {recorded.length > 0 ? (
        <dl className="mt-2 divide-y divide-slate-100">
          {recorded.map((r) => (
            <Detail key={r.label} label={r.label}>
              {r.value}
            </Detail>
          ))}
        </dl>
      ) : null}
      {missing.length > 0 ? (
        <p className="mt-2 border-t border-slate-100 pt-2 text-sm text-slate-600">
          <span className="font-medium">Not recorded:</span> {missing.join(', ')}.
        </p>
      ) : null}
    </>
  );
}
