import type { Refrigerant } from '@/lib/calc/refrigerants';
import { chartRange, type SaturationTableRow } from '@/lib/calc/saturation';
import { fromCelsius, isGaugeUnit, type PressureUnit } from '@/lib/calc/units';
import { pressureLabel, temperatureLabel, type ChartTemperatureUnit } from '@/app/(app)/tools/pt-chart/_components/format';
import { formatChartPressure, formatFixed } from '@/lib/format/numbers';

/** The chart itself: one pressure column for pure fluids and azeotropes, bubble and dew for blends. */
export function PtTable(props: { refrigerant: Refrigerant; rows: SaturationTableRow[]; clipped: boolean; temperatureUnit: ChartTemperatureUnit; pressureUnit: PressureUnit }) {
  const { refrigerant: r, rows, temperatureUnit, pressureUnit } = props;
  const tl = temperatureLabel(temperatureUnit);
  const pl = pressureLabel(pressureUnit);
  const blend = r.zeotropic;
  const span = chartRange(r);
  const min = formatFixed(fromCelsius(span.minC, temperatureUnit), 0, 1);
  const max = formatFixed(fromCelsius(span.maxC, temperatureUnit), 0, 1);
  const anyVacuum = isGaugeUnit(pressureUnit) && rows.some((row) => row.dew < 0 || row.bubble < 0);

  return (
    <div className="grid gap-2">
      {span.note ? <p className="text-sm text-slate-700">{span.note}</p> : null}
      {props.clipped ? (
        <p className="text-sm text-slate-700">
          Rows outside {r.id}&rsquo;s chart range ({min} to {max} {tl}) are left out:{' '}
          {span.note ? 'see the note above' : r.critical ? 'there is no saturation above the critical point' : 'data beyond it are low-confidence'}.
        </p>
      ) : null}
      {rows.length === 0 ? (
        <p className="text-slate-700">No temperatures in that range are inside {r.id}&rsquo;s range.</p>
      ) : (
        <table className="w-full border-collapse text-right tabular-nums">
          <caption className="sr-only">
            {r.id} saturation pressure ({pl}) by temperature ({tl}){blend ? ', bubble and dew points' : ''}
          </caption>
          <thead className="sticky top-0 bg-slate-100 text-sm text-slate-800">
            <tr>
              <th scope="col" className="px-2 py-2 text-left font-semibold">
                Temp. ({tl})
              </th>
              {blend ? (
                <>
                  <th scope="col" className="px-2 py-2 font-semibold">
                    Bubble <span className="font-normal">(liquid)</span> {pl}
                  </th>
                  <th scope="col" className="px-2 py-2 font-semibold">
                    Dew <span className="font-normal">(vapour)</span> {pl}
                  </th>
                </>
              ) : (
                <th scope="col" className="px-2 py-2 font-semibold">
                  Pressure ({pl})
                </th>
              )}
            </tr>
          </thead>
          <tbody className="text-lg">
            {rows.map((row) => (
              <tr key={row.temperature} className="border-b border-slate-200 even:bg-slate-50">
                <th scope="row" className="px-2 py-1.5 text-left font-semibold">
                  {formatFixed(row.temperature, 0, 2)}
                </th>
                <td className="px-2 py-1.5">{formatChartPressure(row.bubble, pressureUnit)}</td>
                {blend ? <td className="px-2 py-1.5">{formatChartPressure(row.dew, pressureUnit)}</td> : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {anyVacuum ? <p className="text-sm text-slate-700">Negative gauge pressures are below atmospheric (a vacuum).</p> : null}
    </div>
  );
}
