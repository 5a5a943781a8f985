'use client';

import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { ChartData } from '@/lib/overview/service';
import { conversionFor, type UnitPrefs } from '@/lib/units/quantities';

// Charts where a person would rather look than read. Each has a heading, a text alternative and
// patterns that survive printing in black and white (solid vs. outlined bars, labelled axes).

function Frame({ title, summary, children }: { title: string; summary: string; children: React.ReactNode }) {
  return (
    <figure className="rounded-lg border border-slate-200 bg-white p-3 break-inside-avoid">
      <figcaption className="mb-2 text-sm font-semibold">{title}</figcaption>
      <div className="h-56" role="img" aria-label={summary}>
        {children}
      </div>
      <p className="sr-only">{summary}</p>
    </figure>
  );
}

export function OverviewCharts({ data, prefs }: { data: ChartData; prefs: UnitPrefs }) {
  // Refrigerant in the viewer's mass unit (stored in kg), rounded to what a scale reads.
  const mass = conversionFor('mass', prefs);
  const amount = (kg: number) => Math.round(mass.fromSi(kg) * 100) / 100;
  const years = [...new Set(data.refrigerantAddedByYear.map((r) => r.year))];
  const systems = [...new Set(data.refrigerantAddedByYear.map((r) => r.system))].slice(0, 6);
  const byYear = years.map((year) => ({ year: String(year), ...Object.fromEntries(systems.map((s) => [s, amount(data.refrigerantAddedByYear.find((r) => r.year === year && r.system === s)?.kg ?? 0)])) }));
  const shades = ['#0f3a56', '#4ea6cf', '#195877', '#86c6e3', '#1d6d93', '#b9dff0'];
  return (
    <div className="grid gap-3 md:grid-cols-2 print:grid-cols-2">
      <Frame title="Condition of the equipment" summary={data.conditionDistribution.map((c) => `${c.rating}: ${c.count}`).join('; ')}>
        <ResponsiveContainer>
          <BarChart data={data.conditionDistribution} margin={{ left: -20 }}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis dataKey="rating" tick={{ fontSize: 11 }} interval={0} angle={-20} textAnchor="end" height={44} />
            <YAxis allowDecimals={false} tick={{ fontSize: 11 }} />
            <Tooltip />
            <Bar dataKey="count" name="Units" fill="#195877" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </Frame>
      <Frame
        title="Age against expected service life (oldest first)"
        summary={data.ageVsLife.slice(0, 8).map((a) => `${a.name}: ${a.ageYears} of ${a.medianYears} years`).join('; ') || 'No install dates recorded'}
      >
        <ResponsiveContainer>
          <BarChart data={data.ageVsLife.slice(0, 10)} layout="vertical" margin={{ left: 10 }}>
            <CartesianGrid strokeDasharray="3 3" horizontal={false} />
            <XAxis type="number" tick={{ fontSize: 11 }} unit=" y" />
            <YAxis type="category" dataKey="name" width={110} tick={{ fontSize: 10 }} />
            <Tooltip />
            <Legend wrapperStyle={{ fontSize: 11 }} />
            <Bar dataKey="ageYears" name="Age" fill="#0f3a56" isAnimationActive={false} />
            <Bar dataKey="medianYears" name="Expected life" fill="#ffffff" stroke="#0f3a56" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </Frame>
      <Frame
        title={`Refrigerant added per system per year (${mass.label})`}
        summary={data.refrigerantAddedByYear.map((r) => `${r.year} ${r.system}: ${amount(r.kg)} ${mass.label}`).join('; ') || 'No refrigerant added on record'}
      >
        <ResponsiveContainer>
          <BarChart data={byYear} margin={{ left: -20 }}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis dataKey="year" tick={{ fontSize: 11 }} />
            <YAxis tick={{ fontSize: 11 }} />
            <Tooltip />
            <Legend wrapperStyle={{ fontSize: 11 }} />
            {systems.map((s, i) => (
              <Bar key={s} dataKey={s} stackId="kg" fill={shades[i % shades.length]} stroke="#0f172a" isAnimationActive={false} />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </Frame>
      <Frame title="Visits per month (last 12 months)" summary={data.visitsPerMonth.map((m) => `${m.month}: ${m.visits}`).join('; ')}>
        <ResponsiveContainer>
          <BarChart data={data.visitsPerMonth} margin={{ left: -20 }}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis dataKey="month" tick={{ fontSize: 10 }} />
            <YAxis allowDecimals={false} tick={{ fontSize: 11 }} />
            <Tooltip />
            <Bar dataKey="visits" name="Visits" fill="#4ea6cf" stroke="#0f3a56" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </Frame>
    </div>
  );
}
