import { Flame, ShieldCheck, Skull, type LucideIcon } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { needsHandlingCaution, refrigerantCautions, SAFETY_CLASS_WORDS } from '@/lib/calc/cautions';
import type { Refrigerant, SafetyClass } from '@/lib/calc/refrigerants';
import { formatNumber } from '@/app/(app)/tools/pt-chart/_components/format';

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
            {glide !== null ? `; glide about ${formatNumber(glide, 1)} K (${formatNumber(glide * 1.8, 1)} °F) at 1 atm` : ''}. GWP {r.gwpAr4} (AR4).
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
