import { CircleCheck, CircleHelp, CircleMinus, OctagonAlert, Sparkles, TriangleAlert, type LucideIcon } from 'lucide-react';
import { conditionLabels, type Condition } from '@/lib/equipment/types';
import { Pill } from '@/components/ui/pill';

// Condition is never colour alone: each rating has its word, its icon and its number.
const looks: Record<Condition, { Icon: LucideIcon; box: string }> = {
  5: { Icon: Sparkles, box: 'border-emerald-300 bg-emerald-50 text-emerald-950' },
  4: { Icon: CircleCheck, box: 'border-ice-300 bg-ice-50 text-ice-950' },
  3: { Icon: CircleMinus, box: 'border-slate-300 bg-slate-100 text-slate-900' },
  2: { Icon: TriangleAlert, box: 'border-amber-400 bg-amber-50 text-amber-950' },
  1: { Icon: OctagonAlert, box: 'border-red-400 bg-red-50 text-red-950' },
};

export function conditionLook(condition: number | null): { Icon: LucideIcon; box: string; word: string } {
  if (condition === null || !(condition in looks)) return { Icon: CircleHelp, box: 'border-slate-300 bg-white text-slate-800', word: 'Not rated' };
  const c = condition as Condition;
  return { ...looks[c], word: conditionLabels[c] };
}

export function ConditionBadge({ condition, size = 'md', className }: { condition: number | null; size?: 'md' | 'lg'; className?: string }) {
  const { Icon, box, word } = conditionLook(condition);
  return (
    <Pill Icon={Icon} box={box} size={size} srPrefix="Condition:" className={className}>
      {word}
      {condition !== null ? (
        <>
          <span aria-hidden className="font-normal">
            {condition}/5
          </span>
          <span className="sr-only">, {condition} of 5</span>
        </>
      ) : null}
    </Pill>
  );
}
