'use client';

import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';

/**
 * The end of every record form: the submit button (its label while saving) and Cancel, which goes
 * back unless the form says otherwise.
 */
export function FormFooter({ submitting, submitLabel, onCancel }: { submitting: boolean; submitLabel: string; onCancel?: () => void }) {
  const router = useRouter();
  return (
    <div className="flex flex-wrap gap-2">
      <Button type="submit" size="lg" disabled={submitting}>
        {submitting ? 'Saving…' : submitLabel}
      </Button>
      <Button variant="secondary" size="lg" onClick={onCancel ?? (() => router.back())}>
        Cancel
      </Button>
    </div>
  );
}
