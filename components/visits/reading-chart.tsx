'use client';

import dynamic from 'next/dynamic';
import { useId, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Field, Select } from '@/components/ui/field';
import { conversionFor, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import { useReadingSeries } from '@/lib/visits/reading-series';
import { formatStamp } from '@/lib/format/dates';
import { SelectOptions } from '@/components/forms/select-options';
import { useNearScreen } from '@/components/ui/use-near-screen';

// The chart library is the largest script of the unit page and the chart sits below the history:
// it is fetched when the chart comes near the screen (or the page is printed), not on first load.
const ReadingChartPlot = dynamic(() => import('@/components/visits/reading-chart-plot').then((m) => m.ReadingChartPlot), { ssr: false });

type Unit = Quantity | 'V' | 'A' | '%' | 'ratio';

// Measured keys are those of readingFields; computed ones are what the server stored beside them.
export const chartableReadings: { key: string; label: string; unit: Unit }[] = [
  { key: 'superheatK', label: 'Superheat', unit: 'temperatureDiff' },
  { key: 'subcoolingK', label: 'Subcooling', unit: 'temperatureDiff' },
  { key: 'suctionKpaG', label: 'Suction pressure', unit: 'pressureGauge' },
  { key: 'dischargeKpaG', label: 'Discharge pressure', unit: 'pressureGauge' },
  { key: 'evaporatingC', label: 'Evaporating (dew point) temperature', unit: 'temperature' },
  { key: 'condensingC', label: 'Condensing (saturation) temperature', unit: 'temperature' },
  { key: 'evaporatorTdK', label: 'Evaporator TD', unit: 'temperatureDiff' },
  { key: 'condenserSplitK', label: 'Condenser split', unit: 'temperatureDiff' },
  { key: 'compressionRatio', label: 'Compression ratio', unit: 'ratio' },
  { key: 'boxC', label: 'Box (return air) temperature', unit: 'temperature' },
  { key: 'supplyAirC', label: 'Supply air temperature', unit: 'temperature' },
  { key: 'suctionLineC', label: 'Suction-line temperature', unit: 'temperature' },
  { key: 'liquidLineC', label: 'Liquid-line temperature', unit: 'temperature' },
  { key: 'ambientC', label: 'Ambient temperature', unit: 'temperature' },
  { key: 'compressorAmps', label: 'Compressor current', unit: 'A' },
  { key: 'fanAmps', label: 'Fan current', unit: 'A' },
  { key: 'controlVolts', label: 'Control voltage', unit: 'V' },
  { key: 'unbalancePct', label: 'Voltage unbalance', unit: '%' },
];

function converter(unit: Unit, prefs: UnitPrefs): { label: string; fromSi: (v: number) => number; decimals: number } {
  if (unit === 'V' || unit === 'A' || unit === '%') return { label: unit, fromSi: (v) => v, decimals: 1 };
  if (unit === 'ratio') return { label: '', fromSi: (v) => v, decimals: 2 };
  return conversionFor(unit, prefs);
}


/** One reading over time for one piece of equipment, in the viewer's units; a table goes with it for print and screen readers. */
/** `timeZone`: the site's, so a reading shows the time it was on site. */
export function ReadingChart({ equipmentId, prefs, timeZone, initialKey = 'superheatK' }: { equipmentId: string; prefs: UnitPrefs; timeZone: string; initialKey?: string }) {
  const [key, setKey] = useState(initialKey);
  const [plotRef, near] = useNearScreen();
  const selectId = useId();
  const series = useReadingSeries(equipmentId, key);
  const meta = chartableReadings.find((r) => r.key === key) ?? chartableReadings[0]!;
  const conv = converter(meta.unit, prefs);
  const points = (series.data?.points ?? []).map((p) => ({ t: new Date(p.recordedAt).getTime(), v: Number(conv.fromSi(p.value).toFixed(conv.decimals)) }));
  const unitText = conv.label ? ` (${conv.label})` : '';

  return (
    <div className="space-y-3">
      <Field id={selectId} label="Reading to plot" className="max-w-md">
        <Select id={selectId} value={key} onChange={(e) => setKey(e.target.value)}>
          <SelectOptions options={chartableReadings.map((r) => ({ value: r.key, label: r.label }))} />
        </Select>
      </Field>
      {series.isError ? (
        <Alert tone="warning" title="The readings could not be loaded." />
      ) : series.isPending ? (
        <p role="status" className="text-slate-600">
          Loading readings…
        </p>
      ) : points.length === 0 ? (
        <p className="rounded-md border border-dashed border-slate-300 bg-white p-4 text-slate-700">No {meta.label.toLowerCase()} recorded yet.</p>
      ) : (
        <figure className="rounded-lg border border-slate-200 bg-white p-2 sm:p-4" aria-label={`${meta.label} over time${unitText}`}>
          <figcaption className="mb-2 px-1 font-semibold text-slate-900">
            {meta.label}
            {unitText} over time
          </figcaption>
          <div ref={plotRef} className="h-64 w-full print:h-56" data-testid="reading-chart">
            {near ? <ReadingChartPlot points={points} unitLabel={conv.label} readingLabel={meta.label} timeZone={timeZone} /> : null}
          </div>
          <details className="mt-2 px-1 print:hidden">
            <summary className="min-h-11 cursor-pointer py-2 font-semibold text-ice-800">Show the values as a table</summary>
            <ValuesTable points={points} unit={conv.label} label={meta.label} timeZone={timeZone} />
          </details>
          <div className="hidden print:block">
            <ValuesTable points={points} unit={conv.label} label={meta.label} timeZone={timeZone} />
          </div>
        </figure>
      )}
    </div>
  );
}

function ValuesTable({ points, unit, label, timeZone }: { points: { t: number; v: number }[]; unit: string; label: string; timeZone: string }) {
  return (
    <table className="mt-2 w-full text-left text-sm">
      <thead>
        <tr className="border-b border-slate-300">
          <th scope="col" className="py-1 pr-4">
            Recorded
          </th>
          <th scope="col" className="py-1">
            {label}
            {unit ? ` (${unit})` : ''}
          </th>
        </tr>
      </thead>
      <tbody>
        {[...points].reverse().map((p, i) => (
          <tr key={`${p.t}-${i}`} className="border-b border-slate-100">
            <td className="py-1 pr-4">{formatStamp(new Date(p.t).toISOString(), timeZone)}</td>
            <td className="py-1 font-semibold tabular-nums">{p.v}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
