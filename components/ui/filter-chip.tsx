import { Check } from 'lucide-react';
import type { ReactNode } from 'react';
import { cn } from '@/lib/utils';

/** A toggle in a row of filters: pressed shows a tick as well as the dark fill (never colour alone). */
export function FilterChip({ pressed, onClick, icon, children }: { pressed: boolean; onClick: () => void; icon?: ReactNode; children: ReactNode }) {
  return (
    <button
      type="button"
      aria-pressed={pressed}
      onClick={onClick}
      className={cn(
        'inline-flex min-h-11 items-center gap-1.5 rounded-full border-2 px-3 text-sm font-semibold',
        pressed ? 'border-ice-800 bg-ice-900 text-white' : 'border-slate-300 bg-white text-slate-900 hover:bg-slate-100',
      )}
    >
      {pressed ? <Check aria-hidden className="size-4" /> : icon}
      {children}
    </button>
  );
}
