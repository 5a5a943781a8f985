import type { LucideIcon } from 'lucide-react';
import { Pill } from '@/components/ui/pill';

/** How one value of a status looks: its icon and its border, background and text colours. */
export type Look = { Icon: LucideIcon; box: string };

/**
 * One value of a status as a pill: icon and colours from the status's look table, the word from the
 * domain's labels, so that each status badge states only its tables (never colour alone).
 */
export function StatusPill<K extends string>({
  value,
  looks,
  labels,
  srPrefix,
  size,
  className,
}: {
  value: K;
  looks: Record<K, Look>;
  labels: Record<K, string>;
  srPrefix: string;
  size?: 'md' | 'lg';
  className?: string;
}) {
  const { Icon, box } = looks[value];
  return (
    <Pill Icon={Icon} box={box} srPrefix={srPrefix} size={size} className={className}>
      {labels[value]}
    </Pill>
  );
}
