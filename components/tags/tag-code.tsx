import { cn } from '@/lib/utils';
import { formatCode } from '@/lib/tags/code';

/**
 * A tag code as people read and type it: monospace, in its groups of three, never broken across
 * lines (a browser would otherwise wrap after each hyphen in a narrow table cell).
 */
export function TagCode({ code, className, ...rest }: { code: string; className?: string } & Omit<React.HTMLAttributes<HTMLSpanElement>, 'children'>) {
  return (
    <span translate="no" className={cn('whitespace-nowrap font-mono font-semibold tracking-wider', className)} {...rest}>
      {formatCode(code)}
    </span>
  );
}
