import { z } from 'zod';
import { withApi } from '@/lib/api/handler';
import { REFERENCE_CAUTION, refrigerantCautions, SAFETY_CLASS_WORDS } from '@/lib/calc/cautions';
import { REFRIGERANTS } from '@/lib/calc/refrigerants';
import { chartRange, SATURATION_BASIS, saturationRange } from '@/lib/calc/saturation';

const BASIS =
  'Designations, compositions and safety classes: ASHRAE Standard 34; GWP: IPCC AR4 and AR5 100-year values where those reports list them (null otherwise), and the EU 517/2014 figure; critical and normal boiling points: CoolProp 8.0.0 reference EOS. Ranges: ' +
  SATURATION_BASIS;

// GET /api/calc/refrigerants: the refrigerants the calculations know, with safety class, GWP, glide and valid range.
const querySchema = z.object({
  temperatureUnit: z.preprocess((v) => (v === '' ? undefined : v), z.enum(['C', 'F'], { error: 'temperature unit must be C or F' }).optional()),
});

export const GET = withApi({ permission: 'calc.use', query: querySchema }, async ({ query }) => ({
  temperatureUnit: query.temperatureUnit ?? 'C',
  items: REFRIGERANTS.map((r) => {
    const range = saturationRange(r);
    return {
      id: r.id,
      chemicalName: r.chemicalName,
      family: r.family,
      blendType: r.blendType,
      zeotropic: r.zeotropic,
      components: r.components,
      safetyClass: r.safetyClass,
      safetyClassWords: SAFETY_CLASS_WORDS[r.safetyClass],
      gwpAr4: r.gwpAr4,
      gwpAr5: r.gwpAr5,
      gwpEu517: r.gwpEu517,
      gwpNote: r.gwpNote ?? null,
      odp: r.odp,
      // Glide at 1 atm (dew − bubble normal boiling point); R-744 has none (solid at 1 atm).
      glideK: r.nbp ? Number((r.nbp.dewC - r.nbp.bubbleC).toFixed(3)) : null,
      nbp: r.nbp,
      critical: r.critical,
      range: { ...r.range, bubbleKpaAbs: range.bubble, dewKpaAbs: range.dew },
      chart: chartRange(r),
      cautions: refrigerantCautions(r),
    };
  }),
  nextCursor: null,
  basis: BASIS,
  cautions: [REFERENCE_CAUTION],
}));
