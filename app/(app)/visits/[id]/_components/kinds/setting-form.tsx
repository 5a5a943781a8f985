'use client';

import { Gauge, Thermometer } from 'lucide-react';
import { useMemo } from 'react';
import { useForm, useWatch, type Path } from 'react-hook-form';
import { FormFooter } from '@/components/forms/form-footer';
import { schemaResolver, type UnitField } from '@/components/forms/schema-resolver';
import { UnitNumberField } from '@/components/forms/unit-number-field';
import { Alert } from '@/components/ui/alert';
import { SAFETY_CONTROL_CAUTION } from '@/lib/calc/cautions';
import { formatQuantity, fromDisplayValue, toDisplayValue, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import {
  computeSettingChange,
  controlsFor,
  settingChangeDataSchema,
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
import { BoundChoiceCards, ComputedPanel, Cautions, NotSaved, useEntrySubmit, type ComputedRow, type ComputingFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

// Settings as found → as left. "As found" starts empty: the technician reads the dial. The unit's
// recorded settings fill it only on an explicit tap, rounded to the reader's units.

type Side = 'low' | 'high' | 'thermostat';
type SettingKey = 'cutInKpaG' | 'cutOutKpaG' | 'setpointC';
type DiffKey = 'differentialKpa' | 'differentialK';

interface SideShape {
  title: string;
  setting: { key: SettingKey; label: string; q: Quantity };
  diff: { key: DiffKey; label: string; q: Quantity };
  /** The setting the differential leads to: low side cut-out, high side cut-in. */
  other: string | null;
}

const sideShapes: Record<Side, SideShape> = {
  low: { title: 'Low side', setting: { key: 'cutInKpaG', label: 'Cut-in', q: 'pressureGauge' }, diff: { key: 'differentialKpa', label: 'Differential', q: 'pressureDiff' }, other: 'Cut-out' },
  high: { title: 'High side', setting: { key: 'cutOutKpaG', label: 'Cut-out', q: 'pressureGauge' }, diff: { key: 'differentialKpa', label: 'Differential', q: 'pressureDiff' }, other: 'Cut-in' },
  thermostat: { title: 'Thermostat', setting: { key: 'setpointC', label: 'Setpoint', q: 'temperature' }, diff: { key: 'differentialK', label: 'Differential', q: 'temperatureDiff' }, other: null },
};

const sidesOf = (c: SettingControl): Side[] => (c === 'dual' ? ['low', 'high'] : [c]);

/**
 * As typed, named as the schema's paths so its errors land on the fields: one control's values at
 * the top (`asFound.cutInKpaG`), a dual control's under its sides (`asFound.low.cutInKpaG`).
 */
type Texts = Record<SettingKey | DiffKey, string>;
type SideTexts = Texts & { low: Texts; high: Texts };
interface SettingValues {
  control: SettingControl;
  asFound: SideTexts;
  asLeft: SideTexts;
}
type Which = 'asFound' | 'asLeft';

const empty: Texts = { cutInKpaG: '', cutOutKpaG: '', setpointC: '', differentialKpa: '', differentialK: '' };
const blankSide = (): SideTexts => ({ ...empty, low: { ...empty }, high: { ...empty } });
const blank = (control: SettingControl): SettingValues => ({ control, asFound: blankSide(), asLeft: blankSide() });

/** The form's name of one side's setting or differential. */
function fieldName(which: Which, control: SettingControl, s: Side, part: 'setting' | 'diff'): Path<SettingValues> {
  const key = part === 'setting' ? sideShapes[s].setting.key : sideShapes[s].diff.key;
  return control === 'dual' && s !== 'thermostat' ? `${which}.${s}.${key}` : `${which}.${key}`;
}

function toSi(c: SettingControl, texts: SideTexts, prefs: UnitPrefs): Record<string, unknown> {
  const side = (s: Side, t: Texts) => {
    const shape = sideShapes[s];
    return { [shape.setting.key]: fromDisplayValue(t[shape.setting.key], shape.setting.q, prefs), [shape.diff.key]: fromDisplayValue(t[shape.diff.key], shape.diff.q, prefs) };
  };
  return c === 'dual' ? { low: side('low', texts.low), high: side('high', texts.high) } : side(c, texts);
}

/** The recorded settings as form text, at the reader's usual precision. */
function recordedTexts(c: SettingControl, recorded: Record<string, unknown>, prefs: UnitPrefs): SideTexts {
  const side = (s: Side, values: Record<string, unknown>): Texts => {
    const shape = sideShapes[s];
    return { ...empty, [shape.setting.key]: toDisplayValue(values[shape.setting.key] as number, shape.setting.q, prefs), [shape.diff.key]: toDisplayValue(values[shape.diff.key] as number, shape.diff.q, prefs) };
  };
  if (c === 'dual') return { ...empty, low: side('low', recorded.low as Record<string, unknown>), high: side('high', recorded.high as Record<string, unknown>) };
  return { ...side(c, recorded), low: { ...empty }, high: { ...empty } };
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

/** A field's label, as the form shows it ("Low cut-in as left"). */
function fieldLabel(control: SettingControl, s: Side, part: 'setting' | 'diff', which: 'found' | 'left'): string {
  const prefix = control === 'dual' ? `${s === 'low' ? 'Low' : 'High'} ` : '';
  const what = part === 'setting' ? sideShapes[s].setting.label.toLowerCase() : 'differential';
  return `${prefix}${what} as ${which}`.replace(/^./, (ch) => ch.toUpperCase());
}

/** Every field of every control, by path, for range errors worded in the reader's units. */
const unitFields: Record<string, UnitField> = Object.fromEntries(
  (['low', 'high', 'dual', 'thermostat'] as const).flatMap((control) =>
    (['found', 'left'] as const).flatMap((which) =>
      sidesOf(control).flatMap((s) =>
        (['setting', 'diff'] as const).map((part) => [
          fieldName(which === 'found' ? 'asFound' : 'asLeft', control, s, part),
          { label: fieldLabel(control, s, part, which), quantity: part === 'setting' ? sideShapes[s].setting.q : sideShapes[s].diff.q },
        ]),
      ),
    ),
  ),
);

export function SettingForm({
  unit,
  ctx,
  prefs,
  onSubmit,
  onCancel,
}: ComputingFormProps<SettingChangeData> & { unit: UnitShape }) {
  const controls = controlsFor(unit);
  const resolver = useMemo(
    () => schemaResolver(settingChangeDataSchema, (v: SettingValues) => ({ control: v.control, asFound: toSi(v.control, v.asFound, prefs), asLeft: toSi(v.control, v.asLeft, prefs) }), { prefs, unitFields }),
    [prefs],
  );
  const form = useForm<SettingValues, unknown, SettingChangeData>({ resolver, defaultValues: blank(controls[0] ?? 'low') });
  // A saved setting change leaves the form as it is: the workspace moves on to the unit.
  const f = useEntrySubmit(form, onSubmit, () => undefined);
  const [control, found, left] = useWatch({ control: form.control, name: ['control', 'asFound', 'asLeft'] });
  const recorded = recordedSettings(unit.nameplate, control);

  const data = useMemo(() => ({ control, asFound: toSi(control, found, prefs), asLeft: toSi(control, left, prefs) }), [control, found, left, prefs]);
  // Live values once both sides are filled in; the server computes the same on save.
  const live = useMemo(() => {
    const parsed = settingChangeDataSchema.safeParse(data);
    return filled(data.asFound) && filled(data.asLeft) && parsed.success ? { input: parsed.data, computed: computeSettingChange(parsed.data, ctx, prefs) } : null;
  }, [data, ctx, prefs]);
  const computed = live?.computed ?? null;

  const fields = (which: 'found' | 'left') => (
    <fieldset className="space-y-3 rounded-lg border border-slate-300 p-3">
      <legend className="px-1 text-base font-bold text-slate-900">As {which}</legend>
      {which === 'found' && recorded ? (
        <button
          type="button"
          onClick={() => form.setValue('asFound', recordedTexts(control, recorded, prefs), { shouldValidate: form.formState.isSubmitted })}
          className="min-h-11 w-full rounded-md border border-ice-300 bg-ice-50 px-3 py-2 text-left font-semibold text-ice-900 hover:bg-ice-100"
        >
          Same as recorded ({recordedWords(control, recorded, prefs)})
        </button>
      ) : null}
      {which === 'found' && !recorded ? <p className="text-sm text-slate-700">No settings are on record for this control: read them from the dial.</p> : null}
      {which === 'left' ? (
        <button type="button" onClick={() => form.setValue('asLeft', form.getValues('asFound'), { shouldValidate: form.formState.isSubmitted })} className="min-h-11 rounded-md px-3 font-semibold text-ice-800 underline hover:bg-ice-50">
          Left as found
        </button>
      ) : null}
      {sidesOf(control).map((s) => {
        const shape = sideShapes[s];
        const w: Which = which === 'found' ? 'asFound' : 'asLeft';
        return (
          <div key={s} className="space-y-2">
            {control === 'dual' ? <p className="font-semibold text-slate-800">{shape.title}</p> : null}
            <div className="grid grid-cols-2 gap-3">
              <UnitNumberField form={form} name={fieldName(w, control, s, 'setting')} id={`setting-${which}-${s}-setting`} label={fieldLabel(control, s, 'setting', which)} quantity={shape.setting.q} prefs={prefs} negative signButton large />
              <UnitNumberField form={form} name={fieldName(w, control, s, 'diff')} id={`setting-${which}-${s}-diff`} label={fieldLabel(control, s, 'diff', which)} quantity={shape.diff.q} prefs={prefs} large />
            </div>
          </div>
        );
      })}
    </fieldset>
  );

  return (
    <form onSubmit={f.submit} noValidate className="space-y-4" aria-label="New setting change">
      {controls.length > 1 ? (
        <BoundChoiceCards
          form={form}
          name="control"
          legend="Which control?"
          onPick={(c) => form.reset(blank(c))}
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
      {fields('found')}
      {fields('left')}
      <ComputedPanel
        title={`${settingControlLabels[control]}: computed`}
        rows={live ? computedRows(control, live.computed, prefs, live.input, ctx) : []}
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
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save setting change" onCancel={onCancel} />
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
