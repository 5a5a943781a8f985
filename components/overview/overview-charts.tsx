'use client';

import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { ChartData } from '@/lib/overview/service';
import { conversionFor, type UnitPrefs } from '@/lib/units/quantities';

// Charts where a person would rather look than read. Each has a heading, a text alternative and
// patterns that survive printing in black and white (solid vs. outlined bars, labelled axes).

function Frame({ title, summary, height, legend, children }: { title: string; summary: string; height?: number; legend?: React.ReactNode; children: React.ReactNode }) {
  return (
    <figure className="min-w-0 rounded-lg border border-slate-200 bg-white p-3 break-inside-avoid">
      <figcaption className="mb-2 text-sm font-semibold">{title}</figcaption>
      <div className={height ? undefined : 'h-56'} style={height ? { height } : undefined} role="img" aria-label={summary}>
        {children}
      </div>
      {legend}
      <p className="sr-only">{summary}</p>
    </figure>
  );
}

/**
 * A legend drawn as page text rather than by the chart: the outlined "expected life" bar is white,
 * and a chart-drawn legend writes each name in its bar's colour (white on white).
 */
function KeyList({ items }: { items: { name: string; fill: string; stroke?: string }[] }) {
  return (
    <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-800" aria-hidden>
      {items.map((i) => (
        <li key={i.name} className="flex min-w-0 items-center gap-1.5">
          <span className="inline-block size-3 shrink-0 rounded-sm border" style={{ background: i.fill, borderColor: i.stroke ?? i.fill }} />
          <span className="min-w-0 break-words">{i.name}</span>
        </li>
      ))}
    </ul>
  );
}

/** A unit's name cut to fit beside its bar; the full names are in the chart's text alternative. */
function shortName(name: string, max = 18): string {
  return name.length > max ? `${name.slice(0, max - 1)}…` : name;
}

/** One label per bar, never thinned out on a narrow screen (recharts drops labels that would wrap). */
function NameTick({ x, y, payload }: { x?: number | string; y?: number | string; payload?: { value?: unknown } }) {
  return (
    <text x={Number(x)} y={Number(y)} dy={4} textAnchor="end" fontSize={11} fill="#1e293b">
      {shortName(String(payload?.value ?? ''))}
    </text>
  );
}

export function OverviewCharts({ data, prefs }: { data: ChartData; prefs: UnitPrefs }) {
  // Refrigerant in the viewer's mass unit (stored in kg), rounded to what a scale reads.
  const mass = conversionFor('mass', prefs);
  const amount = (kg: number) => Math.round(mass.fromSi(kg) * 100) / 100;
  const years = [...new Set(data.refrigerantAddedByYear.map((r) => r.year))];
  // Each circuit named with its site: two sites often have a "Walk-in cooler circuit".
  const circuit = (r: { system: string; site: string }) => `${r.system} · ${r.site}`;
  const systems = [...new Set(data.refrigerantAddedByYear.map(circuit))].slice(0, 6);
  const byYear = years.map((year) => ({ year: String(year), ...Object.fromEntries(systems.map((s) => [s, amount(data.refrigerantAddedByYear.find((r) => r.year === year && circuit(r) === s)?.kg ?? 0)])) }));
  const ages = data.ageVsLife.slice(0, 10);
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
        summary={ages.map((a) => `${a.name}: ${a.ageYears} of ${a.medianYears} years`).join('; ') || 'No install dates recorded'}
        // Room for every bar's label: about 32 px a unit (two bars each) plus the axis.
        height={Math.max(224, ages.length * 32 + 40)}
        legend={
          <KeyList
            items={[
              { name: 'Age (years since installed)', fill: '#0f3a56' },
              { name: 'Expected service life (years)', fill: '#ffffff', stroke: '#0f3a56' },
            ]}
          />
        }
      >
        <ResponsiveContainer>
          <BarChart data={ages} layout="vertical" margin={{ left: 0, right: 8 }}>
            <CartesianGrid strokeDasharray="3 3" horizontal={false} />
            <XAxis type="number" tick={{ fontSize: 11 }} unit=" y" />
            <YAxis type="category" dataKey="name" width={118} interval={0} tick={<NameTick />} />
            <Tooltip />
            <Bar dataKey="ageYears" name="Age" fill="#0f3a56" isAnimationActive={false} />
            <Bar dataKey="medianYears" name="Expected life" fill="#ffffff" stroke="#0f3a56" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </Frame>
      <Frame
        title={`Refrigerant added per circuit and site, per year (${mass.label})`}
        summary={data.refrigerantAddedByYear.map((r) => `${r.year} ${circuit(r)}: ${amount(r.kg)} ${mass.label}`).join('; ') || 'No refrigerant added on record'}
        legend={<KeyList items={systems.map((s, i) => ({ name: s, fill: shades[i % shades.length]!, stroke: '#0f172a' }))} />}
      >
        <ResponsiveContainer>
          <BarChart data={byYear} margin={{ left: -20 }}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis dataKey="year" tick={{ fontSize: 11 }} />
            <YAxis tick={{ fontSize: 11 }} />
            <Tooltip />
            {systems.map((s, i) => (
              <Bar key={s} name={s} dataKey={(row: Record<string, number>) => row[s] ?? 0} stackId="kg" fill={shades[i % shades.length]} stroke="#0f172a" isAnimationActive={false} />
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
