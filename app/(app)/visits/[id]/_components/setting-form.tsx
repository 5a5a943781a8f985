'use client';

import { Gauge, Thermometer } from 'lucide-react';
import { useMemo, useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { SAFETY_CONTROL_CAUTION } from '@/lib/calc/cautions';
import type { EquipmentDto } from '@/lib/equipment/dto';
import { conversionFor, formatQuantity, fromDisplayValue, toDisplayValue, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import { computeSettingChange, type EntryContext } from '@/lib/visits/compute';
import type { SettingChangeData } from '@/lib/visits/schemas';
import { ChoiceCards, ComputedPanel, Cautions, FormActions, NumberInput, type ComputedRow, type FieldErrors, type SubmitResult } from '@/app/(app)/visits/[id]/_components/form-kit';

type Control = SettingChangeData['control'];

interface ControlShape {
  title: string;
  setting: { key: string; label: string; q: Quantity; nameplate: string };
  diff: { key: string; label: string; q: Quantity; nameplate: string };
  /** The setting the control's differential leads to: low side cut-out, high side cut-in. */
  other: string | null;
}

const shapes: Record<Control, ControlShape> = {
  low: {
    title: 'Low-pressure control',
    setting: { key: 'cutInKpaG', label: 'Cut-in', q: 'pressureGauge', nameplate: 'lowCutInKpa' },
    diff: { key: 'differentialKpa', label: 'Differential', q: 'pressureDiff', nameplate: 'lowDifferentialKpa' },
    other: 'Cut-out',
  },
  high: {
    title: 'High-pressure control',
    setting: { key: 'cutOutKpaG', label: 'Cut-out', q: 'pressureGauge', nameplate: 'highCutOutKpa' },
    diff: { key: 'differentialKpa', label: 'Differential', q: 'pressureDiff', nameplate: 'highDifferentialKpa' },
    other: 'Cut-in',
  },
  thermostat: {
    title: 'Thermostat',
    setting: { key: 'setpointC', label: 'Setpoint', q: 'temperature', nameplate: 'setpointC' },
    diff: { key: 'differentialK', label: 'Differential', q: 'temperatureDiff', nameplate: 'differentialK' },
    other: null,
  },
};

function defaultControl(e: EquipmentDto): Control {
  if (e.type === 'thermostat') return 'thermostat';
  if (e.type === 'pressure_control' && e.nameplate.controlKind === 'high') return 'high';
  return 'low';
}

interface Pair {
  setting: string;
  diff: string;
}

function fromNameplate(e: EquipmentDto, c: Control, prefs: UnitPrefs): Pair {
  const s = shapes[c];
  const n = e.nameplate as Record<string, unknown>;
  const v = (k: string, q: Quantity) => (typeof n[k] === 'number' ? toDisplayValue(n[k] as number, q, prefs) : '');
  return { setting: v(s.setting.nameplate, s.setting.q), diff: v(s.diff.nameplate, s.diff.q) };
}

function toData(c: Control, found: Pair, left: Pair, prefs: UnitPrefs): SettingChangeData {
  const s = shapes[c];
  const side = (p: Pair) => ({ [s.setting.key]: fromDisplayValue(p.setting, s.setting.q, prefs), [s.diff.key]: fromDisplayValue(p.diff, s.diff.q, prefs) });
  return { control: c, asFound: side(found), asLeft: side(left) } as unknown as SettingChangeData;
}

const complete = (o: Record<string, unknown>) => Object.values(o).every((v) => typeof v === 'number' && Number.isFinite(v));

export function SettingForm({
  equipment,
  ctx,
  prefs,
  onSubmit,
  onCancel,
}: {
  equipment: EquipmentDto;
  ctx: EntryContext;
  prefs: UnitPrefs;
  onSubmit: (data: SettingChangeData) => Promise<SubmitResult>;
  onCancel: () => void;
}) {
  const [control, setControl] = useState<Control>(defaultControl(equipment));
  const [found, setFound] = useState<Pair>(() => fromNameplate(equipment, defaultControl(equipment), prefs));
  const [left, setLeft] = useState<Pair>(() => fromNameplate(equipment, defaultControl(equipment), prefs));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const shape = shapes[control];

  function choose(c: Control) {
    setControl(c);
    setFound(fromNameplate(equipment, c, prefs));
    setLeft(fromNameplate(equipment, c, prefs));
    setErrors({});
  }

  const data = useMemo(() => toData(control, found, left, prefs), [control, found, left, prefs]);
  // Live values appear once both sides are filled in; the server computes the same thing on save.
  const computed = useMemo(() => (complete(data.asFound) && complete(data.asLeft) ? computeSettingChange(data, ctx) : null), [data, ctx]);

  const rows: ComputedRow[] = [];
  if (computed && shape.other) {
    const p = (v: number | null) => formatQuantity(v, 'pressureGauge', prefs);
    const t = (v: number | null) => (v === null ? '—' : formatQuantity(v, 'temperature', prefs));
    const point = control === 'low' ? 'dew' : 'bubble';
    rows.push(
      { key: 'asFoundOther', label: `${shape.other} as found`, value: p(computed.asFoundOtherKpaG), note: `Saturation (${point}) ${t(computed.asFoundSaturation.other)}` },
      { key: 'asLeftOther', label: `${shape.other} as left`, value: p(computed.asLeftOtherKpaG), note: `Saturation (${point}) ${t(computed.asLeftSaturation.other)}` },
      { key: 'asLeftSetting', label: `${shape.setting.label} as left, saturation (${point})`, value: t(computed.asLeftSaturation.setting) },
    );
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    const result = await onSubmit(data);
    setBusy(false);
    if (!result.ok) {
      setErrors(result.errors);
      setMessage(result.message ?? null);
    }
  }

  const unit = (q: Quantity) => conversionFor(q, prefs).label;
  const side = (label: 'found' | 'left', pair: Pair, set: (p: Pair) => void) => (
    <fieldset className="space-y-3 rounded-lg border border-slate-300 p-3">
      <legend className="px-1 text-base font-bold text-slate-900">As {label}</legend>
      <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2">
        <NumberInput
          id={`setting-${label}-setting`}
          label={`${shape.setting.label} as ${label}`}
          unit={unit(shape.setting.q)}
          value={pair.setting}
          onChange={(v) => set({ ...pair, setting: v })}
          error={errors[`as${label === 'found' ? 'Found' : 'Left'}.${shape.setting.key}`]}
          allowNegative
        />
        <NumberInput
          id={`setting-${label}-diff`}
          label={`${shape.diff.label} as ${label}`}
          unit={unit(shape.diff.q)}
          value={pair.diff}
          onChange={(v) => set({ ...pair, diff: v })}
          error={errors[`as${label === 'found' ? 'Found' : 'Left'}.${shape.diff.key}`]}
        />
      </div>
    </fieldset>
  );

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="New setting change">
      <ChoiceCards<Control>
        name="control"
        legend="Which control?"
        value={control}
        onChange={choose}
        columns="grid-cols-1 min-[400px]:grid-cols-3"
        choices={[
          { value: 'low', label: 'Low pressure', hint: 'Cut-in and differential', Icon: Gauge },
          { value: 'high', label: 'High pressure', hint: 'Cut-out and differential', Icon: Gauge },
          { value: 'thermostat', label: 'Thermostat', hint: 'Setpoint and differential', Icon: Thermometer },
        ]}
      />
      {control !== 'thermostat' ? <Cautions items={[SAFETY_CONTROL_CAUTION]} title="Pressure controls are safety controls" /> : null}
      {side('found', found, setFound)}
      <div className="flex justify-end">
        <button type="button" onClick={() => setLeft(found)} className="min-h-11 rounded-md px-3 font-semibold text-ice-800 underline hover:bg-ice-50">
          As left = as found
        </button>
      </div>
      {side('left', left, setLeft)}
      <ComputedPanel
        title={`${shape.title}: computed`}
        rows={rows}
        bases={computed?.basis ? [computed.basis] : []}
        problems={computed?.problems ?? []}
        empty={shape.other ? 'Fill in both sides to see the other setting and the saturation temperatures.' : 'A thermostat setting is checked against the system’s design box temperature.'}
      />
      {computed?.warnings.map((w) => (
        <Alert key={w.code} tone="warning" title="Check this setting">
          {w.message}
        </Alert>
      ))}
      <p className="text-sm text-slate-700">The equipment’s current settings follow the as-left values when this is saved.</p>
      {message ? (
        <Alert tone="danger" title="Not saved">
          {message}
        </Alert>
      ) : null}
      <FormActions busy={busy} onCancel={onCancel} label="Save setting change" />
    </form>
  );
}
