'use client';

import { useId, useState } from 'react';
import { Card } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';
import { isCalcError } from '@/lib/calc/errors';
import type { Refrigerant } from '@/lib/calc/refrigerants';
import { saturationLookup } from '@/lib/calc/saturation';
import { fromCelsius, fromKpaAbs, isGaugeUnit, temperatureDifferenceFromKelvin, toCelsius, toKpaAbs, type PressureUnit } from '@/lib/calc/units';
import { parseNumber, pressureLabel, temperatureLabel, type ChartTemperatureUnit } from '@/app/(app)/tools/pt-chart/_components/format';
import { formatChartPressure, formatFixed } from '@/lib/format/numbers';

interface Props {
  refrigerant: Refrigerant;
  temperatureUnit: ChartTemperatureUnit;
  pressureUnit: PressureUnit;
  barometricKpa: number;
}

type Outcome = { kind: 'empty' } | { kind: 'error'; message: string } | { kind: 'values'; values: { label: string; value: string }[] };

/** Two-way converter: temperature → bubble/dew pressure, pressure → bubble/dew temperature and glide. */
export function PtConverter({ refrigerant, temperatureUnit, pressureUnit, barometricKpa }: Props) {
  const [temperatureInput, setTemperatureInput] = useState({ text: '', unit: temperatureUnit });
  const [pressureInput, setPressureInput] = useState({ text: '', unit: pressureUnit });
  // A unit switch converts what was typed, so the number on screen never silently changes meaning.
  if (temperatureInput.unit !== temperatureUnit) {
    setTemperatureInput({ text: convertTemperatureText(temperatureInput.text, temperatureInput.unit, temperatureUnit), unit: temperatureUnit });
  }
  if (pressureInput.unit !== pressureUnit) {
    setPressureInput({ text: convertPressureText(pressureInput.text, pressureInput.unit, pressureUnit, barometricKpa), unit: pressureUnit });
  }
  const temperature = temperatureInput.text;
  const pressure = pressureInput.text;
  const setTemperature = (text: string) => setTemperatureInput({ text, unit: temperatureUnit });
  const setPressure = (text: string) => setPressureInput({ text, unit: pressureUnit });
  const tl = temperatureLabel(temperatureUnit);
  const pl = pressureLabel(pressureUnit);
  const blend = refrigerant.zeotropic;

  const fromTemperature = run(temperature, (t) => {
    const r = saturationLookup({ kind: 'temperature', refrigerant: refrigerant.id, temperature: t, unit: temperatureUnit });
    if (r.kind !== 'temperature') return [];
    const bubble = `${formatChartPressure(fromKpaAbs(r.bubbleKpaAbs, pressureUnit, barometricKpa), pressureUnit)} ${pl}`;
    const dew = `${formatChartPressure(fromKpaAbs(r.dewKpaAbs, pressureUnit, barometricKpa), pressureUnit)} ${pl}`;
    return blend
      ? [
          { label: 'Bubble (liquid)', value: bubble },
          { label: 'Dew (vapour)', value: dew },
        ]
      : [{ label: 'Saturation pressure', value: bubble }];
  });

  const fromPressure = run(pressure, (p) => {
    const r = saturationLookup({ kind: 'pressure', refrigerant: refrigerant.id, pressure: p, unit: pressureUnit, barometricKpa, temperatureUnit });
    if (r.kind !== 'pressure') return [];
    const t = (v: number) => `${formatFixed(v, 1)} ${tl}`;
    const values = blend
      ? [
          { label: 'Bubble (liquid)', value: t(r.bubble) },
          { label: 'Dew (vapour)', value: t(r.dew) },
          { label: 'Glide', value: `${formatFixed(temperatureDifferenceFromKelvin(r.glideK, temperatureUnit), 1)} ${temperatureUnit === 'F' ? '°F' : 'K'}` },
        ]
      : [{ label: 'Saturation temperature', value: t(r.bubble) }];
    // Away from sea level, also offer what a sea-level pocket chart reads for the same gauge reading.
    if (r.seaLevel) {
      values.push(
        blend
          ? { label: 'Sea-level chart (dew)', value: t(r.seaLevel.dew) }
          : { label: 'Sea-level chart', value: t(r.seaLevel.bubble) },
      );
    }
    return values;
  });
  const offSeaLevel = Math.abs(barometricKpa - 101.325) > 1e-6 && isGaugeUnit(pressureUnit);

  return (
    <Card className="grid gap-5">
      <div>
        <h2 className="text-lg font-bold text-slate-900">Converter</h2>
        <p className="text-sm text-slate-600">
          {refrigerant.id}, {blend ? 'bubble and dew points' : 'one saturation curve'}; gauge pressures against a barometer of {formatFixed(barometricKpa, 1)} kPa
          {offSeaLevel ? ' (corrected for the site’s elevation; the sea-level chart value, 101.3 kPa, is shown beside it)' : ' (sea level)'}.
        </p>
      </div>
      <Direction
        id="pt-convert-temperature"
        label={`Temperature (${tl})`}
        heading="Temperature to pressure"
        value={temperature}
        onChange={setTemperature}
        outcome={fromTemperature}
        emptyText="Enter a temperature to see its saturation pressure."
      />
      <Direction
        id="pt-convert-pressure"
        label={`Pressure (${pl})`}
        heading="Pressure to temperature"
        value={pressure}
        onChange={setPressure}
        outcome={fromPressure}
        emptyText={blend ? 'Enter a pressure to see its bubble and dew temperatures and the glide.' : 'Enter a pressure to see its saturation temperature.'}
      />
    </Card>
  );
}

function convertTemperatureText(text: string, from: ChartTemperatureUnit, to: ChartTemperatureUnit): string {
  const n = parseNumber(text);
  return n === null ? text : String(Number(fromCelsius(toCelsius(n, from), to).toFixed(2)));
}

function convertPressureText(text: string, from: PressureUnit, to: PressureUnit, barometricKpa: number): string {
  const n = parseNumber(text);
  if (n === null) return text;
  try {
    return String(Number(fromKpaAbs(toKpaAbs(n, from, barometricKpa), to, barometricKpa).toFixed(3)));
  } catch (error) {
    // Below a perfect vacuum in the old unit: keep the text; the result line explains it.
    if (isCalcError(error)) return text;
    throw error;
  }
}

function run(text: string, compute: (n: number) => { label: string; value: string }[]): Outcome {
  if (text.trim() === '') return { kind: 'empty' };
  const n = parseNumber(text);
  if (n === null) return { kind: 'error', message: 'Enter a number.' };
  try {
    return { kind: 'values', values: compute(n) };
  } catch (error) {
    if (!isCalcError(error)) throw error;
    return { kind: 'error', message: error.message.charAt(0).toUpperCase() + error.message.slice(1) + '.' };
  }
}

function Direction(props: {
  id: string;
  label: string;
  heading: string;
  value: string;
  onChange: (v: string) => void;
  outcome: Outcome;
  emptyText: string;
}) {
  const resultId = useId();
  const { outcome } = props;
  const error = outcome.kind === 'error' ? outcome.message : undefined;
  return (
    <section aria-labelledby={`${props.id}-heading`} className="grid gap-2 border-t border-slate-200 pt-4 first-of-type:border-t-0 first-of-type:pt-0">
      <h3 id={`${props.id}-heading`} className="font-semibold text-slate-900">
        {props.heading}
      </h3>
      <Field id={props.id} label={props.label} error={error}>
        <Input
          id={props.id}
          type="number"
          step="any"
          className="text-xl font-semibold tabular-nums"
          value={props.value}
          onChange={(e) => props.onChange(e.target.value)}
          aria-invalid={Boolean(error)}
          aria-describedby={error ? `${props.id}-error` : resultId}
        />
      </Field>
      <div id={resultId} aria-live="polite">
        {outcome.kind === 'values' ? (
          <dl className="grid grid-cols-2 gap-x-4 gap-y-2">
            {outcome.values.map((v) => (
              <div key={v.label}>
                <dt className="text-sm font-medium text-slate-600">{v.label}</dt>
                <dd className="text-2xl font-bold tabular-nums text-slate-900">{v.value}</dd>
              </div>
            ))}
          </dl>
        ) : outcome.kind === 'empty' ? (
          <p className="text-sm text-slate-600">{props.emptyText}</p>
        ) : null}
      </div>
    </section>
  );
}
