import { CircleDashed, Link2, Ban } from 'lucide-react';
import { tagStateLabels, type TagState } from '@/lib/tags/schemas';
import { StatusPill, type Look } from '@/components/status/status-pill';

const looks: Record<TagState, Look> = {
  blank: { Icon: CircleDashed, box: 'border-slate-300 bg-white text-slate-800' },
  attached: { Icon: Link2, box: 'border-ice-300 bg-ice-50 text-ice-950' },
  retired: { Icon: Ban, box: 'border-slate-300 bg-slate-100 text-slate-700' },
};

/** Tag state as a word and an icon, never colour alone. */
export function TagStateBadge({ state, className }: { state: TagState; className?: string }) {
  return <StatusPill value={state} looks={looks} labels={tagStateLabels} srPrefix="Tag state:" className={className} />;
}
