import { CircleDashed, Link2, Ban, type LucideIcon } from 'lucide-react';
import { tagStateLabels, type TagState } from '@/lib/tags/schemas';
import { cn } from '@/lib/utils';

const looks: Record<TagState, { Icon: LucideIcon; box: string }> = {
  blank: { Icon: CircleDashed, box: 'border-slate-300 bg-white text-slate-800' },
  attached: { Icon: Link2, box: 'border-ice-300 bg-ice-50 text-ice-950' },
  retired: { Icon: Ban, box: 'border-slate-300 bg-slate-100 text-slate-700' },
};

/** Tag state as a word and an icon, never colour alone. */
export function TagStateBadge({ state, className }: { state: TagState; className?: string }) {
  const { Icon, box } = looks[state];
  return (
    <span className={cn('inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-semibold', box, className)}>
      <Icon aria-hidden className="size-4" />
      <span className="sr-only">Tag state: </span>
      {tagStateLabels[state]}
    </span>
  );
}
