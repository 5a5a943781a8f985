'use client';

import { AlertTriangle } from 'lucide-react';
import { useId } from 'react';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/modal';

export interface LeaveDialogProps {
  open: boolean;
  /** What would be lost, e.g. "1 photo is not sent yet." */
  message: string;
  onStay: () => void;
  onLeave: () => void;
}

/** "Leave anyway?" with staying as the safe, first-focused answer. */
export function LeaveDialog({ open, message, onStay, onLeave }: LeaveDialogProps) {
  const id = useId();
  return (
    <Modal open={open} onClose={onStay} labelledBy={`${id}-title`} describedBy={`${id}-body`}>
      <h2 id={`${id}-title`} className="flex items-start gap-2 text-lg font-bold">
        <AlertTriangle aria-hidden className="mt-0.5 size-6 shrink-0 text-amber-700" />
        <span>{message} Leave anyway?</span>
      </h2>
      <p id={`${id}-body`} className="text-slate-700">
        If you leave now, it is lost. Stay to let it finish, or to press Retry.
      </p>
      <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
        <Button size="lg" variant="danger" onClick={onLeave}>
          Leave anyway
        </Button>
        <Button size="lg" onClick={onStay} data-autofocus>
          Stay
        </Button>
      </div>
    </Modal>
  );
}
