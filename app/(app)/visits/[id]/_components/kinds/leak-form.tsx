'use client';

import { useState } from 'react';
import { CalendarCheck, CircleCheck, CircleX, ScanSearch, ShieldCheck, TriangleAlert, Wrench, type LucideIcon } from 'lucide-react';
import { CERTIFIED_WORK_CAUTION, FLAMMABLE_LEAK_SEARCH_CAUTION, PRESSURE_TEST_CAUTION, REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { LEAK_ACTIVITIES, LEAK_METHODS, leakActivityLabels, leakMethodLabels, leakResultLabels, leakResultsFor, type LeakActivity, type LeakMethod, type LeakResult } from '@/lib/visits/schemas';
import { ChoiceCards, Cautions, FormActions, useEntryForm, NotSaved, TextArea, TextInput, type Submit } from '@/app/(app)/visits/[id]/_components/form-kit';

const leakActivityLooks: Record<LeakActivity, { Icon: LucideIcon; hint: string }> = {
  inspection: { Icon: ScanSearch, hint: 'Searching the system for leaks' },
  repair: { Icon: Wrench, hint: 'Fixing a leak that was found' },
  initial_verification: { Icon: ShieldCheck, hint: 'Right after the repair, before the full recharge' },
  follow_up_verification: { Icon: CalendarCheck, hint: 'Once the system is back at normal operating conditions' },
};

const leakResultIcons: Record<LeakResult, { Icon: LucideIcon; iconClass: string }> = {
  leak_found: { Icon: TriangleAlert, iconClass: 'text-amber-800' },
  no_leak_found: { Icon: CircleCheck, iconClass: 'text-emerald-800' },
  passed: { Icon: CircleCheck, iconClass: 'text-emerald-800' },
  failed: { Icon: CircleX, iconClass: 'text-red-800' },
};

/** Leak inspections, repairs and the verification tests after a repair, each a record of its own. */
export function LeakForm({ refrigerantCautions, onSubmit, onCancel }: { refrigerantCautions: string[]; onSubmit: Submit; onCancel: () => void }) {
  const [activity, setActivity] = useState<LeakActivity | ''>('');
  const [method, setMethod] = useState<LeakMethod | ''>('');
  const [result, setResult] = useState<LeakResult | ''>('');
  const [location, setLocation] = useState('');
  const [note, setNote] = useState('');
  const f = useEntryForm(onSubmit, () => {
    setActivity('');
    setMethod('');
    setResult('');
    setLocation('');
    setNote('');
  });
  const repair = activity === 'repair';
  const results = activity ? leakResultsFor[activity] : [];
  const locationNeeded = repair || result === 'leak_found';
  const choose = (a: LeakActivity) => {
    setActivity(a);
    // A result of another activity (a "passed" inspection) would only be refused on saving.
    if (result && !leakResultsFor[a].includes(result)) setResult('');
  };
  return (
    <form
      noValidate
      className="space-y-4"
      aria-label="New leak work"
      onSubmit={(e) =>
        f.run(e, {
          activity: activity || undefined,
          method: repair ? undefined : method || undefined,
          result: repair ? undefined : result || undefined,
          location,
          note,
        })
      }
    >
      <Cautions items={[CERTIFIED_WORK_CAUTION, FLAMMABLE_LEAK_SEARCH_CAUTION, ...refrigerantCautions, REFERENCE_CAUTION]} title="Leak work safety" />
      <ChoiceCards<LeakActivity>
        name="leak-activity"
        legend="What was done?"
        value={activity}
        onChange={choose}
        error={f.errors.activity}
        choices={LEAK_ACTIVITIES.map((a) => ({ value: a, label: leakActivityLabels[a], hint: leakActivityLooks[a].hint, Icon: leakActivityLooks[a].Icon }))}
      />
      {activity && !repair ? (
        <>
          <ChoiceCards<LeakMethod>
            name="leak-method"
            legend="Method"
            value={method}
            onChange={setMethod}
            error={f.errors.method}
            choices={LEAK_METHODS.map((m) => ({ value: m, label: leakMethodLabels[m] }))}
          />
          {method === 'pressure_test' ? <Cautions items={[PRESSURE_TEST_CAUTION]} title="Pressure test" /> : null}
          <ChoiceCards<LeakResult>
            name="leak-result"
            legend={activity === 'inspection' ? 'Was a leak found?' : 'Result'}
            value={result}
            onChange={setResult}
            error={f.errors.result}
            choices={results.map((r) => ({ value: r, label: leakResultLabels[r], Icon: leakResultIcons[r].Icon, iconClass: leakResultIcons[r].iconClass }))}
          />
        </>
      ) : null}
      {repair && (f.errors.method || f.errors.result) ? (
        <p role="alert" className="text-sm font-medium text-red-700">
          {f.errors.method ?? f.errors.result}
        </p>
      ) : null}
      {activity ? (
        <TextInput
          id="leak-location"
          label={locationNeeded ? 'Where on the system' : 'Where on the system (optional)'}
          placeholder="e.g. flare nut at the expansion valve inlet"
          value={location}
          onChange={setLocation}
          error={f.errors.location}
        />
      ) : null}
      <TextArea id="leak-note" label="Note (optional)" value={note} onChange={setNote} error={f.errors.note} rows={2} hint={repair ? 'What was done, e.g. the joint re-brazed or the valve core replaced.' : undefined} />
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save leak work" />
    </form>
  );
}
