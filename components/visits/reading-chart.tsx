'use client';

import { useId, useState } from 'react';
import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { Alert } from '@/components/ui/alert';
import { Field, Select } from '@/components/ui/field';
import { conversionFor, type Quantity, type UnitPrefs } from '@/lib/units/quantities';
import { useReadingSeries } from '@/lib/visits/hooks';

type Unit = Quantity | 'V' | 'A' | '%' | 'ratio';

// Measured keys are those of readingFields; computed ones are what the server stored beside them.
export const chartableReadings: { key: string; label: string; unit: Unit }[] = [
  { key: 'superheatK', label: 'Superheat', unit: 'temperatureDiff' },
  { key: 'subcoolingK', label: 'Subcooling', unit: 'temperatureDiff' },
  { key: 'suctionKpaG', label: 'Suction pressure', unit: 'pressureGauge' },
  { key: 'dischargeKpaG', label: 'Discharge pressure', unit: 'pressureGauge' },
  { key: 'evaporatingC', label: 'Evaporating (saturation) temperature', unit: 'temperature' },
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

const shortDate = (ms: number) => new Date(ms).toLocaleDateString('en-US', { month: 'short', day: 'numeric', year: '2-digit' });
const longDate = (ms: number) => new Date(ms).toLocaleString('en-US', { dateStyle: 'medium', timeStyle: 'short' });

/** One reading over time for one piece of equipment, in the viewer's units; a table goes with it for print and screen readers. */
export function ReadingChart({ equipmentId, prefs, initialKey = 'superheatK' }: { equipmentId: string; prefs: UnitPrefs; initialKey?: string }) {
  const [key, setKey] = useState(initialKey);
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
          {chartableReadings.map((r) => (
            <option key={r.key} value={r.key}>
              {r.label}
            </option>
          ))}
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
          <div className="h-64 w-full print:h-56" data-testid="reading-chart">
            <ResponsiveContainer width="100%" height="100%">
              <LineChart data={points} margin={{ top: 8, right: 12, bottom: 8, left: 0 }}>
                <CartesianGrid stroke="#cbd5e1" strokeDasharray="4 4" />
                <XAxis dataKey="t" type="number" scale="time" domain={['dataMin', 'dataMax']} tickFormatter={shortDate} tick={{ fontSize: 13, fill: '#0f172a' }} stroke="#334155" minTickGap={24} />
                <YAxis tick={{ fontSize: 13, fill: '#0f172a' }} stroke="#334155" width={48} domain={['auto', 'auto']} />
                <Tooltip labelFormatter={(v) => longDate(Number(v))} formatter={(v) => [`${v}${conv.label ? ` ${conv.label}` : ''}`, meta.label]} />
                <Line type="linear" dataKey="v" stroke="#0f3a56" strokeWidth={3} dot={{ r: 4, fill: '#0f3a56' }} activeDot={{ r: 6 }} isAnimationActive={false} />
              </LineChart>
            </ResponsiveContainer>
          </div>
          <details className="mt-2 px-1 print:hidden">
            <summary className="min-h-11 cursor-pointer py-2 font-semibold text-ice-800">Show the values as a table</summary>
            <ValuesTable points={points} unit={conv.label} label={meta.label} />
          </details>
          <div className="hidden print:block">
            <ValuesTable points={points} unit={conv.label} label={meta.label} />
          </div>
        </figure>
      )}
    </div>
  );
}

function ValuesTable({ points, unit, label }: { points: { t: number; v: number }[]; unit: string; label: string }) {
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
            <td className="py-1 pr-4">{longDate(p.t)}</td>
            <td className="py-1 font-semibold tabular-nums">{p.v}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
