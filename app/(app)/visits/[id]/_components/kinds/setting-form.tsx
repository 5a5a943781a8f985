'use client';

import { Gauge, Thermometer } from 'lucide-react';
import { useMemo, useState, type FormEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { SAFETY_CONTROL_CAUTION } from '@/lib/calc/cautions';
import { conversionFor, formatQuantity, fromDisplayValue, toDisplayValue, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import {
  computeSettingChange,
  controlsFor,
  recordedSettings,
  settingControlLabels,
  type SettingChangeData,
  type SettingComputed,
  type SettingControl,
  type SideComputed,
  settingWarningText,
} from '@/lib/visits/kinds/setting-change';
import { gaugeSaturationC } from '@/lib/calc/saturation';
import { gaugeBasis } from '@/lib/format/barometer';
import type { EntryContext, UnitShape } from '@/lib/visits/kinds/types';
import { ChoiceCards, ComputedPanel, Cautions, FormActions, NumberInput, type ComputedRow, type FieldErrors, type SubmitResult } from '@/app/(app)/visits/[id]/_components/form-kit';

// Settings as found → as left. "As found" starts empty: the technician reads the dial. The unit's
// recorded settings fill it only on an explicit tap, rounded to the reader's units.

type Side = 'low' | 'high' | 'thermostat';

interface SideShape {
  title: string;
  setting: { key: string; label: string; q: Quantity };
  diff: { key: string; label: string; q: Quantity };
  /** The setting the differential leads to: low side cut-out, high side cut-in. */
  other: string | null;
}

const sideShapes: Record<Side, SideShape> = {
  low: { title: 'Low side', setting: { key: 'cutInKpaG', label: 'Cut-in', q: 'pressureGauge' }, diff: { key: 'differentialKpa', label: 'Differential', q: 'pressureDiff' }, other: 'Cut-out' },
  high: { title: 'High side', setting: { key: 'cutOutKpaG', label: 'Cut-out', q: 'pressureGauge' }, diff: { key: 'differentialKpa', label: 'Differential', q: 'pressureDiff' }, other: 'Cut-in' },
  thermostat: { title: 'Thermostat', setting: { key: 'setpointC', label: 'Setpoint', q: 'temperature' }, diff: { key: 'differentialK', label: 'Differential', q: 'temperatureDiff' }, other: null },
};

const sidesOf = (c: SettingControl): Side[] => (c === 'dual' ? ['low', 'high'] : [c]);

/** Typed text per side: { low: { setting, diff }, … }. */
type Texts = Partial<Record<Side, { setting: string; diff: string }>>;

const blank = (c: SettingControl): Texts => Object.fromEntries(sidesOf(c).map((s) => [s, { setting: '', diff: '' }]));

function toSi(c: SettingControl, texts: Texts, prefs: UnitPrefs): Record<string, unknown> {
  const side = (s: Side) => {
    const shape = sideShapes[s];
    const t = texts[s] ?? { setting: '', diff: '' };
    return { [shape.setting.key]: fromDisplayValue(t.setting, shape.setting.q, prefs), [shape.diff.key]: fromDisplayValue(t.diff, shape.diff.q, prefs) };
  };
  return c === 'dual' ? { low: side('low'), high: side('high') } : side(c);
}

/** The recorded settings as form text, at the reader's usual precision. */
function recordedTexts(c: SettingControl, recorded: Record<string, unknown>, prefs: UnitPrefs): Texts {
  const side = (s: Side, values: Record<string, unknown>) => {
    const shape = sideShapes[s];
    return { setting: toDisplayValue(values[shape.setting.key] as number, shape.setting.q, prefs), diff: toDisplayValue(values[shape.diff.key] as number, shape.diff.q, prefs) };
  };
  if (c === 'dual') return { low: side('low', recorded.low as Record<string, unknown>), high: side('high', recorded.high as Record<string, unknown>) };
  return { [c]: side(c, recorded) };
}

function recordedWords(c: SettingControl, recorded: Record<string, unknown>, prefs: UnitPrefs): string {
  const side = (s: Side, values: Record<string, unknown>) => {
    const shape = sideShapes[s];
    const words = `${shape.setting.label.toLowerCase()} ${formatQuantity(values[shape.setting.key] as number, shape.setting.q, prefs)}, differential ${formatQuantity(values[shape.diff.key] as number, shape.diff.q, prefs)}`;
    return c === 'dual' ? `${s} ${words}` : words;
  };
  return c === 'dual' ? `${side('low', recorded.low as Record<string, unknown>)}; ${side('high', recorded.high as Record<string, unknown>)}` : side(c, recorded);
}

const filled = (o: unknown): boolean =>
  typeof o === 'object' && o !== null && Object.values(o).every((v) => (typeof v === 'object' ? filled(v) : typeof v === 'number' && Number.isFinite(v)));

export function SettingForm({
  unit,
  ctx,
  prefs,
  onSubmit,
  onCancel,
}: {
  unit: UnitShape;
  ctx: EntryContext;
  prefs: UnitPrefs;
  onSubmit: (data: SettingChangeData) => Promise<SubmitResult>;
  onCancel: () => void;
}) {
  const controls = controlsFor(unit);
  const [control, setControl] = useState<SettingControl>(controls[0] ?? 'low');
  const [found, setFound] = useState<Texts>(() => blank(controls[0] ?? 'low'));
  const [left, setLeft] = useState<Texts>(() => blank(controls[0] ?? 'low'));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const recorded = recordedSettings(unit.nameplate, control);

  function choose(c: SettingControl) {
    setControl(c);
    setFound(blank(c));
    setLeft(blank(c));
    setErrors({});
  }

  const data = useMemo(() => ({ control, asFound: toSi(control, found, prefs), asLeft: toSi(control, left, prefs) }) as SettingChangeData, [control, found, left, prefs]);
  // Live values once both sides are filled in; the server computes the same on save.
  const computed = useMemo(() => (filled(data.asFound) && filled(data.asLeft) ? computeSettingChange(data, ctx, prefs) : null), [data, ctx, prefs]);

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

  const unitLabel = (q: Quantity) => conversionFor(q, prefs).label;
  const errorAt = (which: 'Found' | 'Left', s: Side, key: string) => errors[control === 'dual' ? `as${which}.${s}.${key}` : `as${which}.${key}`];

  const fields = (which: 'found' | 'left', texts: Texts, set: (t: Texts) => void) => (
    <fieldset className="space-y-3 rounded-lg border border-slate-300 p-3">
      <legend className="px-1 text-base font-bold text-slate-900">As {which}</legend>
      {which === 'found' && recorded ? (
        <button
          type="button"
          onClick={() => set(recordedTexts(control, recorded, prefs))}
          className="min-h-11 w-full rounded-md border border-ice-300 bg-ice-50 px-3 py-2 text-left font-semibold text-ice-900 hover:bg-ice-100"
        >
          Same as recorded ({recordedWords(control, recorded, prefs)})
        </button>
      ) : null}
      {which === 'found' && !recorded ? <p className="text-sm text-slate-700">No settings are on record for this control: read them from the dial.</p> : null}
      {which === 'left' ? (
        <button type="button" onClick={() => setLeft(found)} className="min-h-11 rounded-md px-3 font-semibold text-ice-800 underline hover:bg-ice-50">
          Left as found
        </button>
      ) : null}
      {sidesOf(control).map((s) => {
        const shape = sideShapes[s];
        const t = texts[s] ?? { setting: '', diff: '' };
        const w = which === 'found' ? 'Found' : 'Left';
        const prefix = control === 'dual' ? `${s === 'low' ? 'Low' : 'High'} ` : '';
        return (
          <div key={s} className="space-y-2">
            {control === 'dual' ? <p className="font-semibold text-slate-800">{shape.title}</p> : null}
            <div className="grid grid-cols-2 gap-3">
              <NumberInput
                id={`setting-${which}-${s}-setting`}
                label={`${prefix}${shape.setting.label.toLowerCase()} as ${which}`.replace(/^./, (ch) => ch.toUpperCase())}
                unit={unitLabel(shape.setting.q)}
                value={t.setting}
                onChange={(v) => set({ ...texts, [s]: { ...t, setting: v } })}
                error={errorAt(w, s, shape.setting.key)}
                allowNegative
              />
              <NumberInput
                id={`setting-${which}-${s}-diff`}
                label={`${prefix}differential as ${which}`.replace(/^./, (ch) => ch.toUpperCase())}
                unit={unitLabel(shape.diff.q)}
                value={t.diff}
                onChange={(v) => set({ ...texts, [s]: { ...t, diff: v } })}
                error={errorAt(w, s, shape.diff.key)}
              />
            </div>
          </div>
        );
      })}
    </fieldset>
  );

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="New setting change">
      {controls.length > 1 ? (
        <ChoiceCards<SettingControl>
          name="control"
          legend="Which control?"
          value={control}
          onChange={choose}
          columns="grid-cols-1 min-[400px]:grid-cols-3"
          choices={controls.map((c) => ({
            value: c,
            label: settingControlLabels[c],
            hint: c === 'low' ? 'Cut-in and differential' : c === 'high' ? 'Cut-out and differential' : c === 'dual' ? 'Both sides in one entry' : 'Setpoint and differential',
            Icon: c === 'thermostat' ? Thermometer : Gauge,
          }))}
        />
      ) : (
        <p className="font-semibold text-slate-900">{settingControlLabels[control]}</p>
      )}
      {control !== 'thermostat' ? <Cautions items={[SAFETY_CONTROL_CAUTION]} title="Pressure controls are safety controls" /> : null}
      {fields('found', found, setFound)}
      {fields('left', left, setLeft)}
      <ComputedPanel
        title={`${settingControlLabels[control]}: computed`}
        rows={computed ? computedRows(control, computed, prefs, data, ctx) : []}
        bases={computed?.basis ? [computed.basis] : []}
        problems={computed?.problems ?? []}
        empty={control === 'thermostat' ? 'A thermostat setting is checked against the system’s design box temperature.' : 'Fill in both sides to see the other setting and the saturation temperatures.'}
      />
      {control !== 'thermostat' && ctx.refrigerant ? (
        <p className="text-sm text-slate-700" data-testid="gauge-basis">
          {gaugeBasis(ctx.elevationM, prefs).text}
        </p>
      ) : null}
      {computed?.warnings.map((w, i) => (
        <Alert key={`${w.code}-${i}`} tone="warning" title="Check this setting">
          {settingWarningText(w, prefs)}
        </Alert>
      ))}
      <p className="text-sm text-slate-700">The unit’s current settings follow the as-left values when this is saved.</p>
      {message ? (
        <Alert tone="danger" title="Not saved">
          {message}
        </Alert>
      ) : null}
      <FormActions busy={busy} onCancel={onCancel} label="Save setting change" />
    </form>
  );
}

function computedRows(control: SettingControl, computed: SettingComputed, prefs: UnitPrefs, data: SettingChangeData, ctx: EntryContext): ComputedRow[] {
  if (control === 'thermostat') return [];
  const p = (v: number | null) => formatQuantity(v, 'pressureGauge', prefs);
  const t = (v: number | null) => formatQuantity(v, 'temperature', prefs);
  const corrected = gaugeBasis(ctx.elevationM, prefs).corrected;
  // Away from sea level, the value a sea-level pocket chart gives for the same gauge setting.
  const sea = (kpaG: number | null | undefined, curve: 'dew' | 'bubble') => {
    if (!corrected || !ctx.refrigerant || typeof kpaG !== 'number') return '';
    const c = gaugeSaturationC(ctx.refrigerant, kpaG, curve);
    return c === null ? '' : `; at sea level ${t(c)}`;
  };
  const asLeft = data.asLeft as Record<string, unknown>;
  const side = (s: 'low' | 'high', c: SideComputed): ComputedRow[] => {
    const shape = sideShapes[s];
    const point = s === 'low' ? 'dew' : 'bubble';
    const prefix = control === 'dual' ? `${shape.title}: ` : '';
    const key = (k: string) => (control === 'dual' ? `${s}-${k}` : k);
    const left = (control === 'dual' ? asLeft[s] : asLeft) as Record<string, number | undefined> | undefined;
    const seaSetting = sea(left?.[shape.setting.key], point);
    return [
      { key: key('asFoundOther'), label: `${prefix}${shape.other} as found`, value: p(c.asFoundOtherKpaG), note: `Saturation (${point}) ${t(c.asFoundSaturation.other)}${sea(c.asFoundOtherKpaG, point)}` },
      { key: key('asLeftOther'), label: `${prefix}${shape.other} as left`, value: p(c.asLeftOtherKpaG), note: `Saturation (${point}) ${t(c.asLeftSaturation.other)}${sea(c.asLeftOtherKpaG, point)}` },
      {
        key: key('asLeftSetting'),
        label: `${prefix}${shape.setting.label} as left, saturation (${point})`,
        value: t(c.asLeftSaturation.setting),
        ...(seaSetting ? { note: seaSetting.replace(/^; at/, 'At') } : {}),
      },
    ];
  };
  if (control === 'dual' && computed.sides) return [...side('low', computed.sides.low), ...side('high', computed.sides.high)];
  return side(control === 'high' ? 'high' : 'low', computed);
}
