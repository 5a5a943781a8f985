'use client';

import { useMemo } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { FormFooter } from '@/components/forms/form-footer';
import { NumberField } from '@/components/forms/number-field';
import { schemaResolver, type UnitField } from '@/components/forms/schema-resolver';
import { Alert } from '@/components/ui/alert';
import { CERTIFIED_WORK_CAUTION, ENERGISED_WORK_CAUTION } from '@/lib/calc/cautions';
import { gaugeSaturationC } from '@/lib/calc/saturation';
import { gaugeBasis } from '@/lib/format/barometer';
import { formatFactor, formatPercent, formatRatio } from '@/lib/format/numbers';
import { conversionFor, formatQuantity, fromDisplayValue, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import { computeReading, readingDataSchema, type ReadingComputed, type ValueLevel } from '@/lib/visits/kinds/reading';
import type { ReadingData, ReadingKey } from '@/lib/visits/schemas';
import { Cautions, ComputedPanel, NotSaved, useEntrySubmit, type ComputedRow, type ComputingFormProps } from '@/app/(app)/visits/[id]/_components/form-kit';

type Unit = Quantity | 'V' | 'A';

const groups: { title: string; fields: { key: ReadingKey; label: string; unit: Unit }[] }[] = [
  {
    title: 'Pressures',
    fields: [
      { key: 'suctionKpaG', label: 'Suction pressure', unit: 'pressureGauge' },
      { key: 'dischargeKpaG', label: 'Discharge pressure', unit: 'pressureGauge' },
    ],
  },
  {
    title: 'Temperatures',
    fields: [
      { key: 'suctionLineC', label: 'Suction-line temperature', unit: 'temperature' },
      { key: 'liquidLineC', label: 'Liquid-line temperature', unit: 'temperature' },
      { key: 'boxC', label: 'Box (return air)', unit: 'temperature' },
      { key: 'supplyAirC', label: 'Supply air', unit: 'temperature' },
      { key: 'ambientC', label: 'Ambient', unit: 'temperature' },
    ],
  },
  {
    title: 'Electrical',
    fields: [
      { key: 'voltsL1L2', label: 'L1–L2', unit: 'V' },
      { key: 'voltsL2L3', label: 'L2–L3', unit: 'V' },
      { key: 'voltsL1L3', label: 'L1–L3', unit: 'V' },
      { key: 'controlVolts', label: 'Control voltage', unit: 'V' },
      { key: 'compressorAmps', label: 'Compressor current', unit: 'A' },
      { key: 'fanAmps', label: 'Fan current', unit: 'A' },
    ],
  },
];
const allFields = groups.flatMap((g) => g.fields);
const electricalKeys: readonly string[] = groups[2]!.fields.map((f) => f.key);
const refrigerantKeys: readonly string[] = allFields.map((f) => f.key).filter((k) => !electricalKeys.includes(k));
const electricalRows = ['unbalancePct', 'supplyVerdict', 'controlVoltageStatus'];

type ReadingValues = Record<ReadingKey, string>;
const blank = Object.fromEntries(allFields.map((f) => [f.key, ''])) as ReadingValues;

/** Parses a typed number; empty → null, junk → NaN (the schema refuses it with a message). */
function parseTyped(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/** Typed text → SI numbers by key (V and A need no conversion); empty fields are left out. */
function readingInput(values: Partial<Record<ReadingKey, string>>, prefs: UnitPrefs): Partial<Record<ReadingKey, number>> {
  const data: Partial<Record<ReadingKey, number>> = {};
  for (const f of allFields) {
    const text = values[f.key] ?? '';
    const v = f.unit === 'V' || f.unit === 'A' ? parseTyped(text) : fromDisplayValue(text, f.unit, prefs);
    if (v !== null) data[f.key] = v;
  }
  return data;
}

/** Range errors of pressures and temperatures are worded in the reader's units. */
const unitFields: Record<string, UnitField> = Object.fromEntries(allFields.flatMap((f) => (f.unit === 'V' || f.unit === 'A' ? [] : [[f.key, { label: f.label, quantity: f.unit }]])));

const statusWords: Record<string, string> = {
  ok: 'Within limits',
  caution: 'Caution',
  derate: 'Derate the motor',
  do_not_operate: 'Do not operate',
  low: 'Low',
  high: 'High',
  marginal: 'Marginal: re-check under load',
  out: 'Out of the coil operating band',
  range_a: 'Range A (normal)',
  range_b: 'Range B (correct the supply)',
  outside: 'Outside Range B',
};

const levelWords = { normal: 'Usual', watch: 'Watch', abnormal: 'Out of the usual' } as const;

/** A value's level in words beside its usual band, in the reader's units; never colour alone. */
function levelLook(judged: ValueLevel | undefined, show: (v: number) => string, note?: string): Pick<ComputedRow, 'note' | 'tone'> {
  if (!judged) return note ? { note } : {};
  const b = judged.band;
  const span = b ? (b.min !== null && b.max !== null ? `${show(b.min)}–${show(b.max)}` : b.max !== null ? `up to ${show(b.max)}` : b.min !== null ? `at least ${show(b.min)}` : '') : '';
  const where = b ? `usual ${span} for ${b.label}`.replace(/\s+/g, ' ').trim() : '';
  const word = `${levelWords[judged.level]}${judged.direction ? ` (${judged.direction})` : ''}`;
  return { note: [note, `${word}${where ? ` · ${where}` : ''}`].filter(Boolean).join(' · '), tone: judged.level === 'normal' ? 'plain' : judged.level === 'watch' ? 'warning' : 'danger' };
}

const referenceWords: Record<string, string> = { midpoint: 'glide mid-point', dew: 'dew point', bubble: 'bubble point' };

/** What the readings were taken with, for the notes beside saturation values (sea level, TD reference). */
export interface RowContext {
  data: ReadingData;
  refrigerant: string | null;
  elevationM: number;
}

/** Computed values as rows in the user's units; the same rounding the history and report use. */
export function readingRows(c: ReadingComputed, prefs: UnitPrefs, at?: RowContext): ComputedRow[] {
  const rows: ComputedRow[] = [];
  const temp = (v: number | null | undefined) => formatQuantity(v, 'temperature', prefs);
  const t = (key: keyof ReadingComputed, label: string, q: Quantity, note?: string) => {
    const v = c[key];
    if (typeof v !== 'number') return;
    const judged = c.levels?.[key as keyof NonNullable<ReadingComputed['levels']>];
    rows.push({ key, label, value: formatQuantity(v, q, prefs), ...levelLook(judged, (x) => formatQuantity(x, q, prefs), note) });
  };
  // Away from sea level, the value a sea-level pocket chart gives for the same gauge reading.
  const basis = at ? gaugeBasis(at.elevationM, prefs) : null;
  const seaNote = (kpaG: number | null | undefined, curve: 'dew' | 'bubble') => {
    if (!basis?.corrected || !at?.refrigerant || typeof kpaG !== 'number') return undefined;
    const sea = gaugeSaturationC(at.refrigerant, kpaG, curve);
    return sea === null ? undefined : `At sea level (pocket chart): ${temp(sea)}`;
  };
  // TD and split say which saturation temperature they were taken from, and show it.
  const refNote = (what: string, reference: string | null | undefined, saturationC: number | null) =>
    reference && saturationC !== null ? `${what} at the ${referenceWords[reference] ?? reference}, ${temp(saturationC)}` : undefined;
  const box = at?.data.boxC;
  const ambient = at?.data.ambientC;
  t('evaporatingC', 'Evaporating (saturation, dew point)', 'temperature', seaNote(at?.data.suctionKpaG, 'dew'));
  t('condensingC', 'Condensing (saturation, bubble point)', 'temperature', seaNote(at?.data.dischargeKpaG, 'bubble'));
  t('superheatK', 'Superheat', 'temperatureDiff', c.superheatK !== null && c.evaporatingC !== null ? 'Suction line − evaporating (dew point) above' : undefined);
  t('subcoolingK', 'Subcooling', 'temperatureDiff', c.subcoolingK !== null && c.condensingC !== null ? 'Condensing (bubble point) above − liquid line' : undefined);
  t('evaporatorTdK', 'Evaporator TD', 'temperatureDiff', refNote('Box − evaporating', c.references?.evaporatorTd, typeof box === 'number' && c.evaporatorTdK !== null ? box - c.evaporatorTdK : null));
  t('condenserSplitK', 'Condenser split', 'temperatureDiff', refNote('Condensing − ambient, condensing', c.references?.condenserSplit, typeof ambient === 'number' && c.condenserSplitK !== null ? ambient + c.condenserSplitK : null));
  if (c.compressionRatio !== null) rows.push({ key: 'compressionRatio', label: 'Compression ratio', value: formatRatio(c.compressionRatio), ...levelLook(c.levels?.compressionRatio, formatRatio) });
  if (c.unbalancePct !== null) {
    rows.push({
      key: 'unbalancePct',
      label: 'Voltage unbalance',
      value: formatPercent(c.unbalancePct),
      note: `${statusWords[c.unbalanceStatus ?? ''] ?? c.unbalanceStatus ?? ''}${c.deratingFactor !== null && c.deratingFactor < 1 ? ` · derating factor ${formatFactor(c.deratingFactor)}` : ''}`,
      tone: c.doNotOperate ? 'danger' : c.unbalanceStatus === 'ok' ? 'plain' : 'warning',
    });
  }
  if (c.supplyVerdict) {
    rows.push({ key: 'supplyVerdict', label: 'Supply voltage', value: statusWords[c.supplyVerdict] ?? c.supplyVerdict, note: c.supplyMessage ?? undefined, tone: c.supplyVerdict === 'range_a' ? 'plain' : 'warning' });
  }
  if (c.controlVoltageStatus) {
    rows.push({
      key: 'controlVoltageStatus',
      label: 'Control voltage',
      value: statusWords[c.controlVoltageStatus] ?? c.controlVoltageStatus,
      note: c.controlVoltageNotes.join(' ') || undefined,
      tone: c.controlVoltageStatus === 'ok' ? 'plain' : c.controlVoltageStatus === 'out' ? 'danger' : 'warning',
    });
  }
  return rows;
}

export function ReadingForm({
  ctx,
  prefs,
  refrigerantCautions,
  onSubmit,
  onCancel,
}: ComputingFormProps<ReadingData> & { refrigerantCautions: string[] }) {
  const resolver = useMemo(() => schemaResolver(readingDataSchema, (v: ReadingValues) => readingInput(v, prefs), { prefs, unitFields }), [prefs]);
  const form = useForm<ReadingValues, unknown, ReadingData>({ resolver, defaultValues: blank });
  const f = useEntrySubmit(form, onSubmit);
  const values = useWatch({ control: form.control });
  const data = useMemo(() => readingInput(values, prefs), [values, prefs]);
  // Only finite numbers go to the calculations; a half-typed value is simply not used yet.
  const { computed, refrigerantSide, electricalSide } = useMemo(() => {
    const clean: ReadingData = Object.fromEntries(Object.entries(data).filter(([, v]) => Number.isFinite(v)));
    const only = (keys: readonly string[]): ReadingData => Object.fromEntries(Object.entries(clean).filter(([k]) => keys.includes(k)));
    // The whole set is what gets stored; each side alone names the bases and problems under its own panel.
    return {
      computed: computeReading(clean, ctx, prefs),
      refrigerantSide: computeReading(only(refrigerantKeys), ctx, prefs),
      electricalSide: computeReading(only(electricalKeys), ctx, prefs),
    };
  }, [data, ctx, prefs]);
  const rows = readingRows(computed, prefs, { data, refrigerant: ctx.refrigerant, elevationM: ctx.elevationM });
  const basis = gaugeBasis(ctx.elevationM, prefs);

  const unitLabel = (u: Unit) => (u === 'V' || u === 'A' ? u : conversionFor(u, prefs).label);

  return (
    <form onSubmit={f.submit} noValidate className="space-y-4" aria-label="New readings">
      <Cautions items={[CERTIFIED_WORK_CAUTION, ...refrigerantCautions]} title="Gauges on a live refrigerant circuit" />
      {!ctx.refrigerant ? (
        <Alert tone="info" title="No refrigerant on record">
          Pressures are saved as read, but cannot be turned into temperatures until the system’s refrigerant is recorded.
        </Alert>
      ) : (
        <p className="text-sm text-slate-700">
          Refrigerant <strong>{ctx.refrigerant}</strong>. <span data-testid="gauge-basis">{basis.text}</span>
        </p>
      )}
      {groups.map((g) => (
        <fieldset key={g.title} className="space-y-3">
          <legend className="text-base font-bold text-slate-900">{g.title}</legend>
          {g.title === 'Electrical' ? <Cautions items={[ENERGISED_WORK_CAUTION]} title="Energised equipment" /> : null}
          <div className="grid grid-cols-1 gap-3 min-[400px]:grid-cols-2 lg:grid-cols-3">
            {g.fields.map((field) => (
              <NumberField
                key={field.key}
                form={form}
                name={field.key}
                id={`reading-${field.key}`}
                label={field.label}
                unit={unitLabel(field.unit)}
                negative={field.unit === 'temperature' || field.unit === 'pressureGauge'}
                signButton
                large
              />
            ))}
          </div>
          {g.title === 'Temperatures' ? (
            <ComputedPanel
              title="Computed refrigerant-side values"
              rows={rows.filter((r) => !electricalRows.includes(r.key))}
              bases={refrigerantSide.bases}
              problems={refrigerantSide.problems}
              empty="Enter pressures and line temperatures to see saturation temperatures, superheat and subcooling."
            />
          ) : null}
          {g.title === 'Temperatures' && computed.suggestions?.length ? (
            <section aria-labelledby="suggest-h" className="rounded-lg border border-slate-300 bg-white p-3" data-testid="reading-suggestions">
              <h4 id="suggest-h" className="font-bold text-slate-900">
                What these readings suggest
              </h4>
              <p className="text-sm text-slate-700">A guide from common practice, not a verdict: confirm before acting.</p>
              <ol className="mt-2 list-decimal space-y-2 pl-5">
                {computed.suggestions.map((x) => (
                  <li key={x.title}>
                    <p className="font-semibold">{x.title}</p>
                    <p className="text-sm">{x.reasoning}</p>
                    <p className="text-sm text-slate-700">Check: {x.checks.join('; ')}</p>
                  </li>
                ))}
              </ol>
            </section>
          ) : null}
          {g.title === 'Electrical' ? (
            <>
              <ComputedPanel
                title="Computed electrical values"
                rows={rows.filter((r) => electricalRows.includes(r.key))}
                bases={electricalSide.bases}
                problems={electricalSide.problems}
                empty="Enter the three line voltages for unbalance and the supply check, or the control voltage."
              />
              {computed.doNotOperate ? (
                <Alert tone="danger" title="Do not operate the motor at this unbalance">
                  Have the supply corrected first; running a motor at this unbalance overheats its windings.
                </Alert>
              ) : null}
            </>
          ) : null}
        </fieldset>
      ))}
      <NotSaved message={f.message} />
      <FormFooter submitting={f.busy} submitLabel="Save readings" onCancel={onCancel} />
    </form>
  );
}
