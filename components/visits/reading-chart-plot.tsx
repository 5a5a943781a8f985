'use client';

import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatShortDay, formatStamp } from '@/lib/format/dates';

const shortDate = (ms: number, timeZone: string) => formatShortDay(new Date(ms).toISOString(), timeZone);

/** The drawing of components/visits/reading-chart.tsx, in its own module so recharts loads only when the chart is near. */
export function ReadingChartPlot({ points, unitLabel, readingLabel, timeZone }: { points: { t: number; v: number }[]; unitLabel: string; readingLabel: string; timeZone: string }) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <LineChart data={points} margin={{ top: 8, right: 12, bottom: 8, left: 0 }}>
        <CartesianGrid stroke="#cbd5e1" strokeDasharray="4 4" />
        <XAxis dataKey="t" type="number" scale="time" domain={['dataMin', 'dataMax']} tickFormatter={(ms: number) => shortDate(ms, timeZone)} tick={{ fontSize: 13, fill: '#0f172a' }} stroke="#334155" minTickGap={24} />
        <YAxis tick={{ fontSize: 13, fill: '#0f172a' }} stroke="#334155" width={48} domain={['auto', 'auto']} />
        <Tooltip labelFormatter={(v) => formatStamp(new Date(Number(v)).toISOString(), timeZone)} formatter={(v) => [`${v}${unitLabel ? ` ${unitLabel}` : ''}`, readingLabel]} />
        <Line type="linear" dataKey="v" stroke="#0f3a56" strokeWidth={3} dot={{ r: 4, fill: '#0f3a56' }} activeDot={{ r: 6 }} isAnimationActive={false} />
      </LineChart>
    </ResponsiveContainer>
  );
}
