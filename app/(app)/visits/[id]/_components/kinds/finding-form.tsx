'use client';

import { useForm, useWatch } from 'react-hook-form';
import { BoundField } from '@/components/forms/bound-field';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver } from '@/components/forms/schema-resolver';
import { severityLooks } from '@/components/visits/badges';
import { findingDataSchema, type FindingData } from '@/lib/visits/kinds/finding';
import { SEVERITIES, severityLabels, type Severity } from '@/lib/visits/schemas';
import { BoundCheckCard, BoundChoiceCards, NotSaved, useEntrySubmit, type EntryFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

interface FindingValues {
  text: string;
  severity: Severity | '';
  raiseFollowUp: boolean;
  followUpTitle: string;
}

const resolver = schemaResolver(findingDataSchema, (v: FindingValues) => ({
  text: v.text,
  severity: v.severity || undefined,
  raiseFollowUp: v.raiseFollowUp,
  followUpTitle: v.raiseFollowUp ? v.followUpTitle : '',
}));
const blank: FindingValues = { text: '', severity: '', raiseFollowUp: false, followUpTitle: '' };

export function FindingForm({ onSubmit, onCancel }: EntryFormProps<FindingData>) {
  const form = useForm<FindingValues, unknown, FindingData>({ resolver, defaultValues: blank });
  const f = useEntrySubmit(form, onSubmit);
  const raise = useWatch({ control: form.control, name: 'raiseFollowUp' });
  return (
    <form noValidate className="space-y-4" aria-label="New finding" onSubmit={f.submit}>
      <BoundField form={form} name="text" id="finding-text" label="What was found" multiline={3} />
      <BoundChoiceCards
        form={form}
        name="severity"
        id="finding-severity"
        legend="Severity"
        choices={SEVERITIES.map((s) => ({ value: s, label: severityLabels[s], hint: severityLooks[s].hint, Icon: severityLooks[s].Icon, iconClass: s === 'safety' || s === 'down' ? 'text-red-800' : s === 'degraded' ? 'text-amber-800' : 'text-slate-700' }))}
      />
      <BoundCheckCard form={form} name="raiseFollowUp" id="finding-raise">
        Raise a follow-up for the office
        <span className="block text-sm font-normal text-slate-700">It stays open on the site and in Follow-ups until it is resolved or declined.</span>
      </BoundCheckCard>
      {raise ? <BoundField form={form} name="followUpTitle" id="finding-title" label="Follow-up title (optional)" hint="Leave empty to use the finding’s first words." input={{ autoComplete: 'off', className: 'min-h-12' }} /> : null}
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save finding" onCancel={onCancel} />
    </form>
  );
}
