'use client';

import { FileDown, FileSpreadsheet } from 'lucide-react';
import { useState } from 'react';
import { EmptyState } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';
import { LabelledSelect } from '@/components/forms/labelled-select';

export function RefrigerantReportPicker({ systems }: { systems: { id: string; label: string }[] }) {
  const [systemId, setSystemId] = useState(systems[0]?.id ?? '');
  const [year, setYear] = useState(String(new Date().getFullYear()));
  if (systems.length === 0) return <EmptyState title="No systems registered yet." />;
  const valid = /^\d{4}$/.test(year);
  const href = (format: 'pdf' | 'csv') => `/api/reports/refrigerant?systemId=${systemId}&year=${year}&format=${format}`;
  return (
    <div className="grid gap-3 rounded-lg border border-slate-200 bg-white p-4 sm:grid-cols-[1fr_8rem_auto] sm:items-end">
      <LabelledSelect id="ref-system" label="System" value={systemId} onChange={(e) => setSystemId(e.target.value)} options={systems.map((s) => ({ value: s.id, label: s.label }))} />
      <Field id="ref-year" label="Year" error={valid ? undefined : 'Use a four-digit year.'}>
        <Input id="ref-year" inputMode="numeric" value={year} onChange={(e) => setYear(e.target.value)} />
      </Field>
      <div className="flex gap-2">
        {(['pdf', 'csv'] as const).map((f) => (
          <a
            key={f}
            href={valid ? href(f) : undefined}
            aria-disabled={!valid}
            download
            className="inline-flex min-h-11 items-center gap-1.5 rounded-md border border-slate-300 bg-white px-3 text-sm font-semibold hover:bg-ice-50 aria-disabled:opacity-50"
          >
            {f === 'pdf' ? <FileDown aria-hidden className="size-4" /> : <FileSpreadsheet aria-hidden className="size-4" />}
            {f.toUpperCase()}
          </a>
        ))}
      </div>
    </div>
  );
}
