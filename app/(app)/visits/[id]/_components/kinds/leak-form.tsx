'use client';

import { useForm, useWatch } from 'react-hook-form';
import { CalendarCheck, CircleCheck, CircleX, ScanSearch, ShieldCheck, TriangleAlert, Wrench, type LucideIcon } from 'lucide-react';
import { CERTIFIED_WORK_CAUTION, FLAMMABLE_LEAK_SEARCH_CAUTION, PRESSURE_TEST_CAUTION, REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { leakDataSchema, type LeakData } from '@/lib/visits/kinds/leak';
import { LEAK_ACTIVITIES, LEAK_METHODS, leakActivityLabels, leakMethodLabels, leakResultLabels, leakResultsFor, type LeakActivity, type LeakMethod, type LeakResult } from '@/lib/visits/schemas';
import { BoundChoiceCards, Cautions, NotSaved, useEntrySubmit, type EntryFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

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

interface LeakValues {
  activity: LeakActivity | '';
  method: LeakMethod | '';
  result: LeakResult | '';
  location: string;
  note: string;
}

const resolver = schemaResolver(leakDataSchema, (v: LeakValues) => {
  const repair = v.activity === 'repair';
  return { activity: v.activity || undefined, method: repair ? undefined : v.method || undefined, result: repair ? undefined : v.result || undefined, location: v.location, note: v.note };
});
const blank: LeakValues = { activity: '', method: '', result: '', location: '', note: '' };

/** Leak inspections, repairs and the verification tests after a repair, each a record of its own. */
export function LeakForm({ refrigerantCautions, onSubmit, onCancel }: { refrigerantCautions: string[] } & EntryFormProps<LeakData>) {
  const form = useForm<LeakValues, unknown, LeakData>({ resolver, defaultValues: blank });
  const f = useEntrySubmit(form, onSubmit);
  const [activity, method, result] = useWatch({ control: form.control, name: ['activity', 'method', 'result'] });
  const errors = form.formState.errors;
  const repair = activity === 'repair';
  const results = activity ? leakResultsFor[activity] : [];
  const locationNeeded = repair || result === 'leak_found';
  // A result of another activity (a "passed" inspection) would only be refused on saving.
  const chosen = (a: LeakActivity) => {
    if (result && !leakResultsFor[a].includes(result)) form.setValue('result', '');
  };
  return (
    <form noValidate className="space-y-4" aria-label="New leak work" onSubmit={f.submit}>
      <Cautions items={[CERTIFIED_WORK_CAUTION, FLAMMABLE_LEAK_SEARCH_CAUTION, ...refrigerantCautions, REFERENCE_CAUTION]} title="Leak work safety" />
      <BoundChoiceCards
        form={form}
        name="activity"
        id="leak-activity"
        legend="What was done?"
        onPick={chosen}
        choices={LEAK_ACTIVITIES.map((a) => ({ value: a, label: leakActivityLabels[a], hint: leakActivityLooks[a].hint, Icon: leakActivityLooks[a].Icon }))}
      />
      {activity && !repair ? (
        <>
          <BoundChoiceCards form={form} name="method" id="leak-method" legend="Method" choices={LEAK_METHODS.map((m) => ({ value: m, label: leakMethodLabels[m] }))} />
          {method === 'pressure_test' ? <Cautions items={[PRESSURE_TEST_CAUTION]} title="Pressure test" /> : null}
          <BoundChoiceCards
            form={form}
            name="result"
            id="leak-result"
            legend={activity === 'inspection' ? 'Was a leak found?' : 'Result'}
            choices={results.map((r) => ({ value: r, label: leakResultLabels[r], Icon: leakResultIcons[r].Icon, iconClass: leakResultIcons[r].iconClass }))}
          />
        </>
      ) : null}
      {repair && (errors.method || errors.result) ? (
        <p role="alert" className="text-sm font-medium text-red-700">
          {errors.method?.message ?? errors.result?.message}
        </p>
      ) : null}
      {activity ? (
        <BoundField
          form={form}
          name="location"
          id="leak-location"
          label={locationNeeded ? 'Where on the system' : 'Where on the system (optional)'}
          input={{ placeholder: 'e.g. flare nut at the expansion valve inlet', autoComplete: 'off', className: 'min-h-12' }}
        />
      ) : null}
      <BoundField form={form} name="note" id="leak-note" label="Note (optional)" multiline={2} hint={repair ? 'What was done, e.g. the joint re-brazed or the valve core replaced.' : undefined} />
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save leak work" onCancel={onCancel} />
    </form>
  );
}
