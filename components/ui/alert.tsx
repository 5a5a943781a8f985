import { AlertTriangle, CheckCircle2, Info, OctagonAlert } from 'lucide-react';
import type { ReactNode } from 'react';
import { cn } from '@/lib/utils';

const tones = {
  info: { box: 'border-ice-300 bg-ice-50 text-ice-950', Icon: Info, word: 'Note' },
  success: { box: 'border-emerald-300 bg-emerald-50 text-emerald-950', Icon: CheckCircle2, word: 'Done' },
  warning: { box: 'border-amber-400 bg-amber-50 text-amber-950', Icon: AlertTriangle, word: 'Caution' },
  danger: { box: 'border-red-400 bg-red-50 text-red-950', Icon: OctagonAlert, word: 'Stop' },
} as const;

/** Status is never colour alone: every alert carries an icon and a word. */
export function Alert({ tone = 'info', title, children, className }: { tone?: keyof typeof tones; title?: string; children?: ReactNode; className?: string }) {
  const { box, Icon, word } = tones[tone];
  return (
    <div role={tone === 'danger' || tone === 'warning' ? 'alert' : 'status'} className={cn('flex gap-3 rounded-md border p-3', box, className)}>
      <Icon aria-hidden className="mt-0.5 size-5 shrink-0" />
      <div className="text-sm">
        <p className="font-semibold">
          <span className="sr-only">{word}: </span>
          {title ?? word}
        </p>
        {children ? <div className="mt-1">{children}</div> : null}
      </div>
    </div>
  );
}
