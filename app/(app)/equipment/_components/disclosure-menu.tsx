'use client';

import { ChevronDown } from 'lucide-react';
import { useEffect, useRef, type ReactNode } from 'react';
import { cn } from '@/lib/utils';

/**
 * A native <details> drop-down (keyboard and screen readers get it for free) that also closes on
 * Escape and on a click outside. On a phone it opens in place instead of floating.
 */
export function DisclosureMenu({ label, count, children, align = 'left', className }: { label: string; count?: number; children: ReactNode; align?: 'left' | 'right'; className?: string }) {
  const ref = useRef<HTMLDetailsElement>(null);
  useEffect(() => {
    function close(event: Event) {
      const el = ref.current;
      if (!el?.open) return;
      if (event instanceof KeyboardEvent) {
        if (event.key !== 'Escape') return;
        el.open = false;
        el.querySelector('summary')?.focus();
        return;
      }
      if (!el.contains(event.target as Node)) el.open = false;
    }
    document.addEventListener('pointerdown', close);
    document.addEventListener('keydown', close);
    return () => {
      document.removeEventListener('pointerdown', close);
      document.removeEventListener('keydown', close);
    };
  }, []);
  return (
    <details ref={ref} className={cn('group relative', className)}>
      <summary className="flex min-h-11 cursor-pointer list-none items-center gap-2 rounded-md border border-slate-300 bg-white px-3 text-sm font-semibold text-slate-900 hover:bg-slate-100 group-open:border-ice-700 [&::-webkit-details-marker]:hidden">
        {label}
        {count ? (
          <span className="rounded-full bg-ice-900 px-2 text-xs leading-5 text-white">
            {count}
            <span className="sr-only"> selected</span>
          </span>
        ) : null}
        <ChevronDown aria-hidden className="size-4 transition-transform group-open:rotate-180" />
      </summary>
      <div
        className={cn(
          'z-20 mt-1 max-h-[70vh] w-full min-w-56 overflow-y-auto rounded-md border border-slate-300 bg-white p-2 shadow-lg sm:absolute sm:w-64',
          align === 'right' ? 'sm:right-0' : 'sm:left-0',
        )}
      >
        {children}
      </div>
    </details>
  );
}

export function CheckOption({ checked, onChange, children }: { checked: boolean; onChange: (checked: boolean) => void; children: ReactNode }) {
  return (
    <label className="flex min-h-11 cursor-pointer items-center gap-3 rounded px-2 text-sm font-medium text-slate-900 hover:bg-slate-100">
      <input type="checkbox" className="size-5 shrink-0 accent-ice-800" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      {children}
    </label>
  );
}
