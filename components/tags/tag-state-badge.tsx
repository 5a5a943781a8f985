import { CircleDashed, Link2, Ban, type LucideIcon } from 'lucide-react';
import { tagStateLabels, type TagState } from '@/lib/tags/schemas';
import { Pill } from '@/components/ui/pill';

const looks: Record<TagState, { Icon: LucideIcon; box: string }> = {
  blank: { Icon: CircleDashed, box: 'border-slate-300 bg-white text-slate-800' },
  attached: { Icon: Link2, box: 'border-ice-300 bg-ice-50 text-ice-950' },
  retired: { Icon: Ban, box: 'border-slate-300 bg-slate-100 text-slate-700' },
};

/** Tag state as a word and an icon, never colour alone. */
export function TagStateBadge({ state, className }: { state: TagState; className?: string }) {
  const { Icon, box } = looks[state];
  return (
    <Pill Icon={Icon} box={box} srPrefix="Tag state:" className={className}>
      {tagStateLabels[state]}
    </Pill>
  );
}
