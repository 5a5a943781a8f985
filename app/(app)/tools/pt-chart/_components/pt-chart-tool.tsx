'use client';

import { useMemo, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';
import { barometricPressureKpa, MAX_ELEVATION_M, MIN_ELEVATION_M } from '@/lib/calc/atmosphere';
import { REFERENCE_CAUTION } from '@/lib/calc/cautions';
import { isCalcError } from '@/lib/calc/errors';
import { getRefrigerant, REFRIGERANTS, type RefrigerantId } from '@/lib/calc/refrigerants';
import { chartRange, saturationTable, type SaturationTableRow } from '@/lib/calc/saturation';
import { fromCelsius, KPA_PER_PSI, STANDARD_ATMOSPHERE_KPA, type PressureUnit } from '@/lib/calc/units';
import { parseNumber, PRESSURE_UNIT_OPTIONS, RANGE_DEFAULTS, temperatureLabel, type ChartTemperatureUnit } from '@/app/(app)/tools/pt-chart/_components/format';
import { formatFixed } from '@/lib/format/numbers';
import { PtConverter } from '@/app/(app)/tools/pt-chart/_components/pt-converter';
import { PtTable } from '@/app/(app)/tools/pt-chart/_components/pt-table';
import { RefrigerantSafety } from '@/app/(app)/tools/pt-chart/_components/refrigerant-safety';
import { LabelledSelect } from '@/components/forms/labelled-select';

export interface SiteElevation {
  id: string;
  label: string;
  elevationM: number;
}

const FT_PER_M = 1 / 0.3048;

type TableState =
  | { ok: true; rows: SaturationTableRow[]; clipped: boolean }
  | { ok: false; field: 'from' | 'to' | 'step'; message: string };

export function PtChartTool(props: {
  initialRefrigerant: RefrigerantId;
  initialTemperatureUnit: ChartTemperatureUnit;
  initialPressureUnit: PressureUnit;
  lengthUnit: 'ft' | 'm';
  sites: SiteElevation[];
}) {
  const [refrigerantId, setRefrigerantId] = useState<RefrigerantId>(props.initialRefrigerant);
  const [temperatureUnit, setTemperatureUnit] = useState<ChartTemperatureUnit>(props.initialTemperatureUnit);
  const [pressureUnit, setPressureUnit] = useState<PressureUnit>(props.initialPressureUnit);
  const [range, setRange] = useState(RANGE_DEFAULTS[props.initialTemperatureUnit]);
  const [siteId, setSiteId] = useState('');
  const [elevation, setElevation] = useState('');

  const refrigerant = getRefrigerant(refrigerantId);
  const { lengthUnit } = props;

  const barometer = useMemo((): { kpa: number; elevationM: number | null; error: string | null } => {
    const typed = parseNumber(elevation);
    if (elevation.trim() !== '' && typed === null) return { kpa: STANDARD_ATMOSPHERE_KPA, elevationM: null, error: 'Enter the elevation as a number.' };
    if (typed === null) return { kpa: STANDARD_ATMOSPHERE_KPA, elevationM: null, error: null };
    const metres = lengthUnit === 'ft' ? typed / FT_PER_M : typed;
    try {
      return { kpa: barometricPressureKpa(metres), elevationM: metres, error: null };
    } catch (error) {
      if (isCalcError(error)) {
        const [min, max] = [MIN_ELEVATION_M, MAX_ELEVATION_M].map((m) => formatFixed(lengthUnit === 'ft' ? m * FT_PER_M : m, 0));
        return { kpa: STANDARD_ATMOSPHERE_KPA, elevationM: null, error: `Enter an elevation from ${min} to ${max} ${lengthUnit}.` };
      }
      throw error;
    }
  }, [elevation, lengthUnit]);

  const table = useMemo((): TableState => {
    const from = parseNumber(range.from);
    const to = parseNumber(range.to);
    const step = parseNumber(range.step);
    if (from === null) return { ok: false, field: 'from', message: 'Enter the first temperature.' };
    if (to === null) return { ok: false, field: 'to', message: 'Enter the last temperature.' };
    if (step === null || step <= 0) return { ok: false, field: 'step', message: 'Enter a step greater than zero.' };
    try {
      const t = saturationTable(refrigerant, { from, to, step, temperatureUnit, pressureUnit, barometricKpa: barometer.kpa });
      return { ok: true, rows: t.rows, clipped: t.clipped };
    } catch (error) {
      if (!isCalcError(error)) throw error;
      const field = error.field === 'to' || error.field === 'step' ? error.field : 'from';
      return { ok: false, field, message: sentence(error.message) };
    }
  }, [refrigerant, range, temperatureUnit, pressureUnit, barometer.kpa]);

  function chooseRefrigerant(id: RefrigerantId) {
    setRefrigerantId(id);
    // The choice lives in the URL so a bookmark or a shared link opens the same refrigerant.
    window.history.replaceState(null, '', `?refrigerant=${encodeURIComponent(id)}`);
  }

  function chooseTemperatureUnit(unit: ChartTemperatureUnit) {
    setTemperatureUnit(unit);
    setRange(RANGE_DEFAULTS[unit]);
  }

  function chooseSite(id: string) {
    setSiteId(id);
    const site = props.sites.find((s) => s.id === id);
    setElevation(site ? String(Math.round(lengthUnit === 'ft' ? site.elevationM * FT_PER_M : site.elevationM)) : '');
  }

  const tl = temperatureLabel(temperatureUnit);
  const span = chartRange(refrigerant);
  const rangeHint = `${refrigerant.id} covers ${formatFixed(fromCelsius(span.minC, temperatureUnit), 0, 1)} to ${formatFixed(fromCelsius(span.maxC, temperatureUnit), 0, 1)} ${tl}.`;
  const baroText = barometerText(barometer.kpa, barometer.elevationM, lengthUnit);

  return (
    <div className="grid gap-5 lg:grid-cols-[minmax(0,24rem)_minmax(0,1fr)] lg:items-start">
      <div className="grid gap-5">
        <Card className="grid gap-4">
          <h2 className="text-lg font-bold text-slate-900">Refrigerant and units</h2>
          <LabelledSelect
            id="pt-refrigerant"
            label="Refrigerant (ASHRAE designation)"
            value={refrigerantId}
            onChange={(e) => chooseRefrigerant(e.target.value as RefrigerantId)}
            selectClassName="text-lg font-semibold"
            options={REFRIGERANTS.map((r) => ({ value: r.id, label: `${r.id} · ${r.safetyClass} · ${r.family}` }))}
          />
          <RefrigerantSafety refrigerant={refrigerant} />

          <fieldset>
            <legend className="mb-1 text-sm font-semibold text-slate-800">Temperature unit</legend>
            <div className="grid grid-cols-2 gap-2">
              {(['F', 'C'] as const).map((unit) => (
                <label
                  key={unit}
                  className="flex min-h-11 cursor-pointer items-center gap-3 rounded-md border border-slate-300 bg-white px-3 font-semibold has-[:checked]:border-ice-700 has-[:checked]:bg-ice-50"
                >
                  <input type="radio" name="pt-temperature-unit" className="size-5 accent-ice-800" checked={temperatureUnit === unit} onChange={() => chooseTemperatureUnit(unit)} />
                  {unit === 'F' ? '°F' : '°C'}
                </label>
              ))}
            </div>
          </fieldset>
          <LabelledSelect id="pt-pressure-unit" label="Pressure unit" value={pressureUnit} onChange={(e) => setPressureUnit(e.target.value as PressureUnit)} options={PRESSURE_UNIT_OPTIONS} />

          <fieldset className="grid gap-3 rounded-md border border-slate-200 p-3">
            <legend className="px-1 text-sm font-semibold text-slate-800">Site elevation (for gauge pressures)</legend>
            {props.sites.length > 0 ? (
              <LabelledSelect
                id="pt-site"
                label="Site"
                value={siteId}
                onChange={(e) => chooseSite(e.target.value)}
                empty="None: use the elevation below"
                options={props.sites.map((s) => ({ value: s.id, label: s.label }))}
              />
            ) : null}
            <Field id="pt-elevation" label={`Elevation (${lengthUnit})`} error={barometer.error ?? undefined} hint="Blank means sea level.">
              <Input
                id="pt-elevation"
                type="number"
                step="any"
                value={elevation}
                onChange={(e) => {
                  setElevation(e.target.value);
                  setSiteId('');
                }}
                aria-invalid={Boolean(barometer.error)}
                aria-describedby={barometer.error ? 'pt-elevation-error' : 'pt-elevation-hint pt-barometer'}
              />
            </Field>
            <p id="pt-barometer" className="text-sm text-slate-700">
              {baroText}
            </p>
          </fieldset>
        </Card>

        <PtConverter refrigerant={refrigerant} temperatureUnit={temperatureUnit} pressureUnit={pressureUnit} barometricKpa={barometer.kpa} />
      </div>

      <Card className="grid gap-4">
        <h2 className="text-lg font-bold text-slate-900">Pressure–temperature chart</h2>
        <fieldset>
          <legend className="mb-1 text-sm font-semibold text-slate-800">Temperatures ({tl})</legend>
          <div className="grid grid-cols-3 gap-2">
            {(
              [
                ['from', 'From'],
                ['to', 'To'],
                ['step', 'Step'],
              ] as const
            ).map(([key, label]) => {
              const error = !table.ok && table.field === key ? table.message : undefined;
              return (
                <Field key={key} id={`pt-${key}`} label={`${label} (${tl})`} error={error}>
                  <Input
                    id={`pt-${key}`}
                    type="number"
                    step="any"
                    min={key === 'step' ? 0 : undefined}
                    value={range[key]}
                    onChange={(e) => setRange((r) => ({ ...r, [key]: e.target.value }))}
                    aria-invalid={Boolean(error)}
                    aria-describedby={error ? `pt-${key}-error` : 'pt-range-hint'}
                  />
                </Field>
              );
            })}
          </div>
          <p id="pt-range-hint" className="mt-1 text-sm text-slate-600">
            {rangeHint}
          </p>
        </fieldset>
        {table.ok ? (
          <PtTable refrigerant={refrigerant} rows={table.rows} clipped={table.clipped} temperatureUnit={temperatureUnit} pressureUnit={pressureUnit} />
        ) : (
          <p className="text-slate-700">Fix the temperatures above to see the chart.</p>
        )}
      </Card>

      <div className="lg:col-span-2">
        <Alert tone="info" title="Basis and limits">
          <p>
            Pressures come from a Wagner-form vapour-pressure correlation fitted to CoolProp 8.0.0 reference equation-of-state data (within 0.1 % of that
            data from −50 to +50 °C). {refrigerant.id} data: {refrigerant.dataSource}.
          </p>
          <p className="mt-1">{baroText}</p>
          <p className="mt-1 font-semibold">{REFERENCE_CAUTION}</p>
        </Alert>
      </div>
    </div>
  );
}

function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1) + (message.endsWith('.') ? '' : '.');
}

function barometerText(kpa: number, elevationM: number | null, lengthUnit: 'ft' | 'm'): string {
  const where =
    elevationM === null
      ? 'the standard atmosphere at sea level'
      : `the standard atmosphere (ICAO) at ${formatFixed(lengthUnit === 'ft' ? elevationM * FT_PER_M : elevationM, 0)} ${lengthUnit}`;
  return `Gauge pressures are against ${formatFixed(kpa, 2)} kPa (${formatFixed(kpa / KPA_PER_PSI, 2)} psi), ${where}. Absolute pressures do not depend on it.`;
}
