import { withApi } from '@/lib/api/handler';
import { refrigerantResultCautions } from '@/lib/calc/cautions';
import { getRefrigerant } from '@/lib/calc/refrigerants';
import { saturationLookup } from '@/lib/calc/saturation';
import { saturationQuerySchema } from '@/lib/calc/schemas';

// GET /api/calc/saturation: saturation pressure at a temperature, or temperature at a pressure (bubble and dew).
export const GET = withApi({ permission: 'calc.use', query: saturationQuerySchema }, async ({ query }) => {
  const result = saturationLookup(query);
  const refrigerant = getRefrigerant(result.refrigerant);
  return { ...result, safetyClass: refrigerant.safetyClass, cautions: refrigerantResultCautions(refrigerant) };
});
