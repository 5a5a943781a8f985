'use client';

import { useState } from 'react';
import { severityLooks } from '@/components/visits/badges';
import { SEVERITIES, severityLabels, type Severity } from '@/lib/visits/schemas';
import { CheckCard, ChoiceCards, FormActions, useEntryForm, NotSaved, TextArea, TextInput, type Submit } from '@/app/(app)/visits/[id]/_components/form-kit';

export function FindingForm({ onSubmit, onCancel }: { onSubmit: Submit; onCancel: () => void }) {
  const [text, setText] = useState('');
  const [severity, setSeverity] = useState<Severity | ''>('');
  const [raise, setRaise] = useState(false);
  const [title, setTitle] = useState('');
  const f = useEntryForm(onSubmit, () => {
    setText('');
    setSeverity('');
    setRaise(false);
    setTitle('');
  });
  return (
    <form noValidate className="space-y-4" aria-label="New finding" onSubmit={(e) => f.run(e, { text, severity: severity || undefined, raiseFollowUp: raise, followUpTitle: raise ? title : '' })}>
      <TextArea id="finding-text" label="What was found" value={text} onChange={setText} error={f.errors.text} />
      <ChoiceCards<Severity>
        name="finding-severity"
        legend="Severity"
        value={severity}
        onChange={setSeverity}
        error={f.errors.severity}
        choices={SEVERITIES.map((s) => ({ value: s, label: severityLabels[s], hint: severityLooks[s].hint, Icon: severityLooks[s].Icon, iconClass: s === 'safety' || s === 'down' ? 'text-red-800' : s === 'degraded' ? 'text-amber-800' : 'text-slate-700' }))}
      />
      <CheckCard id="finding-raise" checked={raise} onChange={setRaise}>
        Raise a follow-up for the office
        <span className="block text-sm font-normal text-slate-700">It stays open on the site and in Follow-ups until it is resolved or declined.</span>
      </CheckCard>
      {raise ? <TextInput id="finding-title" label="Follow-up title (optional)" value={title} onChange={setTitle} error={f.errors.followUpTitle} hint="Leave empty to use the finding’s first words." /> : null}
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save finding" />
    </form>
  );
}
