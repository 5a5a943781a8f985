'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { ApiError } from '@/lib/api/client';
import { useUpdateProfile } from '@/lib/users/hooks';

export function PreferencesForm(props: { name: string; units: 'imperial' | 'metric'; metricPressure: 'kPa' | 'bar' }) {
  const router = useRouter();
  const update = useUpdateProfile();
  const [name, setName] = useState(props.name);
  const [units, setUnits] = useState(props.units);
  const [metricPressure, setMetricPressure] = useState(props.metricPressure);
  const [status, setStatus] = useState<{ tone: 'success' | 'danger'; text: string }>();

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    try {
      await update.mutateAsync({ name, units, metricPressure });
      setStatus({ tone: 'success', text: 'Saved.' });
      router.refresh();
    } catch (error) {
      setStatus({ tone: 'danger', text: error instanceof ApiError ? error.message : 'Could not save.' });
    }
  }

  return (
    <form onSubmit={onSubmit} className="grid max-w-xl gap-5">
      {status ? <Alert tone={status.tone} title={status.text} /> : null}
      <Field id="pref-name" label="Your name">
        <Input id="pref-name" value={name} onChange={(e) => setName(e.target.value)} />
      </Field>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Units</legend>
        {(
          [
            ['imperial', 'Imperial: psig, °F, lb'],
            ['metric', 'Metric: kPa or bar, °C, kg'],
          ] as const
        ).map(([value, label]) => (
          <label key={value} className="flex min-h-11 items-center gap-3 rounded-md border border-slate-200 bg-white px-3">
            <input type="radio" name="units" className="size-5" checked={units === value} onChange={() => setUnits(value)} />
            {label}
          </label>
        ))}
      </fieldset>
      {units === 'metric' ? (
        <fieldset className="space-y-2">
          <legend className="text-sm font-semibold">Metric pressure</legend>
          {(['kPa', 'bar'] as const).map((value) => (
            <label key={value} className="flex min-h-11 items-center gap-3 rounded-md border border-slate-200 bg-white px-3">
              <input type="radio" name="metricPressure" className="size-5" checked={metricPressure === value} onChange={() => setMetricPressure(value)} />
              {value}
            </label>
          ))}
        </fieldset>
      ) : null}
      <div>
        <Button type="submit" size="lg" disabled={update.isPending}>
          Save preferences
        </Button>
      </div>
    </form>
  );
}
