import { Flame, ShieldCheck, Skull, type LucideIcon } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { needsHandlingCaution, refrigerantCautions, SAFETY_CLASS_WORDS } from '@/lib/calc/cautions';
import type { Refrigerant, SafetyClass } from '@/lib/calc/refrigerants';
import { formatFixed } from '@/lib/format/numbers';

const CLASS_ICONS: Record<SafetyClass, LucideIcon> = { A1: ShieldCheck, A2L: Flame, A3: Flame, B2L: Skull };

/** Safety class as icon + words (never colour alone), the blend facts, and handling cautions. */
export function RefrigerantSafety({ refrigerant: r }: { refrigerant: Refrigerant }) {
  const Icon = CLASS_ICONS[r.safetyClass];
  const glide = r.nbp && r.zeotropic ? r.nbp.dewC - r.nbp.bubbleC : null;
  return (
    <div className="grid gap-3">
      <p className="flex items-start gap-2 text-slate-800">
        <Icon aria-hidden className="mt-0.5 size-5 shrink-0 text-slate-700" />
        <span>
          <span className="font-semibold">Safety class {r.safetyClass}</span>: {SAFETY_CLASS_WORDS[r.safetyClass]}.{' '}
          <span className="text-slate-700">
            {r.chemicalName}
            {glide !== null ? `; glide about ${formatFixed(glide, 1)} K (${formatFixed(glide * 1.8, 1)} °F) at 1 atm` : ''}. {gwpText(r)}.
          </span>
        </span>
      </p>
      {needsHandlingCaution(r) ? (
        <Alert tone="warning" title={`Handling caution: ${r.id}`}>
          {refrigerantCautions(r).map((c) => (
            <p key={c}>{c}</p>
          ))}
        </Alert>
      ) : null}
    </div>
  );
}

/** GWP with its basis: AR4 where IPCC AR4 lists it, else AR5, else the regulatory figure, said as such. */
function gwpText(r: Refrigerant): string {
  if (r.gwpAr4 !== null) return `GWP ${r.gwpAr4} (IPCC AR4)${r.gwpAr5 !== null ? `, ${r.gwpAr5} (AR5)` : ''}`;
  if (r.gwpAr5 !== null) return `GWP ${r.gwpAr5} (IPCC AR5; not in AR4), ${r.gwpEu517} as EU 517/2014 counts it`;
  return `GWP ${r.gwpEu517} as EU 517/2014 counts it (not tabulated by IPCC AR4 or AR5)`;
}
