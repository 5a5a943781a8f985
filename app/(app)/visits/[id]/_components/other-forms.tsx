'use client';

import { ArrowDownToLine, ArrowUpFromLine, CalendarCheck, CircleCheck, CircleX, ScanSearch, ShieldCheck, TriangleAlert, Wrench, type LucideIcon } from 'lucide-react';
import { useEffect, useState, type FormEvent, type ReactNode } from 'react';
import { conditionLook } from '@/components/equipment/condition-badge';
import { Alert } from '@/components/ui/alert';
import { describedBy, Field, Input, Select, Textarea } from '@/components/ui/field';
import { severityLooks } from '@/components/visits/badges';
import { CERTIFIED_WORK_CAUTION, FLAMMABLE_LEAK_SEARCH_CAUTION, PRESSURE_TEST_CAUTION, REFERENCE_CAUTION, SAFETY_CONTROL_CAUTION } from '@/lib/calc/cautions';
import { REFRIGERANT_IDS } from '@/lib/calc/refrigerants';
import { CONDITIONS } from '@/lib/equipment/types';
import { conversionFor, fromDisplayValue, type UnitPrefs } from '@/lib/units/quantities';
import type { EntryContext } from '@/lib/visits/kinds/types';
import {
  LEAK_ACTIVITIES,
  LEAK_METHODS,
  leakActivityLabels,
  leakMethodLabels,
  leakResultLabels,
  leakResultsFor,
  SEVERITIES,
  severityLabels,
  type LeakActivity,
  type LeakMethod,
  type LeakResult,
  type Severity,
} from '@/lib/visits/schemas';
import {
  CheckCard,
  ChoiceCards,
  Cautions,
  FormActions,
  NumberInput,
  Stepper,
  type FieldErrors,
  type SubmitResult,
} from '@/app/(app)/visits/[id]/_components/form-kit';

type Submit = (data: Record<string, unknown>) => Promise<SubmitResult>;

/** Shared plumbing: busy flag, the server's field errors and message, reset after a save. */
function useEntryForm(onSubmit: Submit, reset: () => void) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function run(e: FormEvent, data: Record<string, unknown>) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    const result = await onSubmit(data);
    setBusy(false);
    if (result.ok) {
      setErrors({});
      reset();
    } else {
      setErrors(result.errors);
      setMessage(result.message ?? null);
    }
  }
  return { errors, message, busy, run };
}

function NotSaved({ message }: { message: string | null }) {
  return message ? (
    <Alert tone="danger" title="Not saved">
      {message}
    </Alert>
  ) : null;
}

function TextArea({ id, label, value, onChange, error, hint, rows = 3 }: { id: string; label: string; value: string; onChange: (v: string) => void; error?: string; hint?: ReactNode; rows?: number }) {
  return (
    <Field id={id} label={label} error={error} hint={hint}>
      <Textarea id={id} rows={rows} value={value} onChange={(e) => onChange(e.target.value)} className="text-base" {...describedBy(id, error)} />
    </Field>
  );
}

function TextInput({ id, label, value, onChange, error, hint, placeholder }: { id: string; label: string; value: string; onChange: (v: string) => void; error?: string; hint?: ReactNode; placeholder?: string }) {
  return (
    <Field id={id} label={label} error={error} hint={hint}>
      <Input id={id} value={value} placeholder={placeholder} autoComplete="off" onChange={(e) => onChange(e.target.value)} className="min-h-12" {...describedBy(id, error)} />
    </Field>
  );
}

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

export function ActionForm({ onSubmit, onCancel }: { onSubmit: Submit; onCancel: () => void }) {
  const [text, setText] = useState('');
  const [bypass, setBypass] = useState(false);
  const [description, setDescription] = useState('');
  const f = useEntryForm(onSubmit, () => {
    setText('');
    setBypass(false);
    setDescription('');
  });
  return (
    <form noValidate className="space-y-4" aria-label="New action" onSubmit={(e) => f.run(e, { text, bypassedControl: bypass, bypassDescription: bypass ? description : '' })}>
      <TextArea id="action-text" label="What was done" value={text} onChange={setText} error={f.errors.text} />
      <CheckCard id="action-bypass" checked={bypass} onChange={setBypass} tone="warning">
        I bypassed a safety or operating control (jumper) to diagnose
        <span className="block text-sm font-normal text-slate-700">For example a jumper across a pressure control or a thermostat.</span>
      </CheckCard>
      {bypass ? (
        <>
          <Alert tone="danger" title="Remove the jumper before you leave">
            <p>{SAFETY_CONTROL_CAUTION}</p>
            <p className="mt-1 font-semibold">This visit cannot be closed until you confirm the bypass was removed.</p>
          </Alert>
          <TextInput
            id="action-bypass-description"
            label="Which control was bypassed, and how"
            placeholder="e.g. jumper across the low-pressure control"
            value={description}
            onChange={setDescription}
            error={f.errors.bypassDescription}
          />
        </>
      ) : null}
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save action" />
    </form>
  );
}

export function PartForm({ onSubmit, onCancel, equipmentName }: { onSubmit: Submit; onCancel: () => void; equipmentName: string }) {
  const [part, setPart] = useState('');
  const [quantity, setQuantity] = useState(1);
  const [oldSerial, setOldSerial] = useState('');
  const [newSerial, setNewSerial] = useState('');
  const [whole, setWhole] = useState(false);
  const f = useEntryForm(onSubmit, () => {
    setPart('');
    setQuantity(1);
    setOldSerial('');
    setNewSerial('');
    setWhole(false);
  });
  return (
    <form noValidate className="space-y-4" aria-label="New part replaced" onSubmit={(e) => f.run(e, { part, quantity, oldSerial, newSerial, replacesEquipment: whole })}>
      <TextInput id="part-name" label="Part" placeholder="e.g. condenser fan motor" value={part} onChange={setPart} error={f.errors.part} />
      <Stepper id="part-quantity" label="Quantity" value={quantity} onChange={setQuantity} />
      <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2">
        <TextInput id="part-old-serial" label="Old serial (optional)" value={oldSerial} onChange={setOldSerial} error={f.errors.oldSerial} />
        <TextInput id="part-new-serial" label="New serial (optional)" value={newSerial} onChange={setNewSerial} error={f.errors.newSerial} />
      </div>
      <CheckCard id="part-whole" checked={whole} onChange={setWhole}>
        The whole component was replaced
        <span className="block text-sm font-normal text-slate-700">
          “{equipmentName}” is kept with its history and marked removed; a new record takes its place with the new serial.
        </span>
      </CheckCard>
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save part" />
    </form>
  );
}

const CERT_KEY = 'rimeline:technician-cert';

export function RefrigerantForm({
  ctx,
  prefs,
  refrigerantCautions,
  onSubmit,
  onCancel,
}: {
  ctx: EntryContext;
  prefs: UnitPrefs;
  refrigerantCautions: string[];
  onSubmit: Submit;
  onCancel: () => void;
}) {
  const [direction, setDirection] = useState<'added' | 'recovered' | ''>('');
  const [amount, setAmount] = useState('');
  const [refrigerant, setRefrigerant] = useState(ctx.refrigerant ?? '');
  const [cylinderId, setCylinderId] = useState('');
  const [cert, setCert] = useState('');
  // The certification number is the technician's own: remembered on this phone so it is typed once.
  useEffect(() => setCert(window.localStorage.getItem(CERT_KEY) ?? ''), []);
  const f = useEntryForm(
    async (data) => {
      const result = await onSubmit(data);
      if (result.ok && cert.trim()) window.localStorage.setItem(CERT_KEY, cert.trim());
      return result;
    },
    () => {
      setDirection('');
      setAmount('');
      setCylinderId('');
    },
  );
  const mass = conversionFor('mass', prefs);
  return (
    <form
      noValidate
      className="space-y-4"
      aria-label="New refrigerant entry"
      onSubmit={(e) =>
        f.run(e, { direction: direction || undefined, amountKg: fromDisplayValue(amount, 'mass', prefs) ?? undefined, refrigerant: refrigerant || undefined, cylinderId, technicianCert: cert })
      }
    >
      <Cautions items={[CERTIFIED_WORK_CAUTION, 'Never add a different refrigerant (“topping off” with another type); a retrofit is recorded on the system first.', ...refrigerantCautions]} title="Refrigerant handling" />
      <ChoiceCards<'added' | 'recovered'>
        name="refrigerant-direction"
        legend="Added or recovered?"
        value={direction}
        onChange={setDirection}
        error={f.errors.direction}
        choices={[
          { value: 'added', label: 'Added', hint: 'Charged into the system', Icon: ArrowDownToLine },
          { value: 'recovered', label: 'Recovered', hint: 'Taken out into a recovery cylinder', Icon: ArrowUpFromLine },
        ]}
      />
      <NumberInput id="refrigerant-amount" label="Amount" unit={mass.label} value={amount} onChange={setAmount} error={f.errors.amountKg} />
      {ctx.refrigerant ? (
        <p className="rounded-md border border-slate-300 bg-white px-3 py-2">
          Refrigerant: <strong>{ctx.refrigerant}</strong> <span className="text-sm text-slate-700">(the system’s refrigerant)</span>
        </p>
      ) : (
        <Field id="refrigerant-id" label="Refrigerant" error={f.errors.refrigerant} hint="No refrigerant is on record for this system.">
          <Select id="refrigerant-id" value={refrigerant} onChange={(e) => setRefrigerant(e.target.value)} {...describedBy('refrigerant-id', f.errors.refrigerant)}>
            <option value="">Choose…</option>
            {REFRIGERANT_IDS.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </Select>
        </Field>
      )}
      {f.errors.refrigerant && ctx.refrigerant ? (
        <p role="alert" className="text-sm font-medium text-red-700">
          {f.errors.refrigerant}
        </p>
      ) : null}
      <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2">
        <TextInput id="refrigerant-cylinder" label="Cylinder id" placeholder="e.g. CYL-0042" value={cylinderId} onChange={setCylinderId} error={f.errors.cylinderId} />
        <TextInput id="refrigerant-cert" label="Your certification number" value={cert} onChange={setCert} error={f.errors.technicianCert} hint="Remembered on this phone." />
      </div>
      <p className="text-sm text-slate-700">On an addition the leak rate is worked out from the system’s full charge and its last addition, and shown once the entry is saved.</p>
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save refrigerant" />
    </form>
  );
}

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

export function ConditionForm({ current, onSubmit, onCancel }: { current: number | null; onSubmit: Submit; onCancel: () => void }) {
  const [rating, setRating] = useState<string>(current ? String(current) : '');
  const [note, setNote] = useState('');
  const f = useEntryForm(onSubmit, () => setNote(''));
  return (
    <form noValidate className="space-y-4" aria-label="New condition rating" onSubmit={(e) => f.run(e, { rating: rating ? Number(rating) : undefined, note })}>
      <ChoiceCards<string>
        name="condition-rating"
        legend="Condition now"
        value={rating}
        onChange={setRating}
        error={f.errors.rating}
        columns="grid-cols-1 min-[400px]:grid-cols-2 md:grid-cols-5"
        choices={CONDITIONS.map((c) => {
          const look = conditionLook(c);
          return { value: String(c), label: `${c} · ${look.word}`, Icon: look.Icon };
        })}
      />
      <TextArea id="condition-note" label="Note (optional)" value={note} onChange={setNote} error={f.errors.note} rows={2} />
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save condition" />
    </form>
  );
}

export function NoteForm({ onSubmit, onCancel }: { onSubmit: Submit; onCancel: () => void }) {
  const [text, setText] = useState('');
  const f = useEntryForm(onSubmit, () => setText(''));
  return (
    <form noValidate className="space-y-4" aria-label="New note" onSubmit={(e) => f.run(e, { text })}>
      <TextArea id="note-text" label="Note" value={text} onChange={setText} error={f.errors.text} rows={4} />
      <NotSaved message={f.message} />
      <FormActions busy={f.busy} onCancel={onCancel} label="Save note" />
    </form>
  );
}
