import { withApi } from '@/lib/api/handler';
import { resolveBarometricKpa } from '@/lib/calc/atmosphere';
import { refrigerantResultCautions } from '@/lib/calc/cautions';
import { getRefrigerant } from '@/lib/calc/refrigerants';
import { chartRange, saturationTable } from '@/lib/calc/saturation';
import { saturationTableQuerySchema } from '@/lib/calc/schemas';

// GET /api/calc/pt-table: pressure–temperature chart rows (bubble and dew) in the caller's units.
export const GET = withApi({ permission: 'calc.use', query: saturationTableQuerySchema }, async ({ query }) => {
  const refrigerant = getRefrigerant(query.refrigerant);
  const table = saturationTable(refrigerant, query);
  return {
    refrigerant: table.refrigerant,
    temperatureUnit: query.temperatureUnit,
    pressureUnit: query.pressureUnit,
    barometricKpa: resolveBarometricKpa(query),
    zeotropic: refrigerant.zeotropic,
    safetyClass: refrigerant.safetyClass,
    // The chart's span: the saturation range, capped where the fit is known to drift (with why).
    range: chartRange(refrigerant),
    clipped: table.clipped,
    rows: table.rows,
    basis: table.basis,
    cautions: refrigerantResultCautions(refrigerant),
  };
});
