'use client';

import { useEffect, useRef, type ReactNode } from 'react';
import { cn } from '@/lib/utils';

// The browser's own modal <dialog>: it keeps focus inside, makes the page behind inert, and
// Escape asks to close. Mark the control to focus first with data-autofocus. On a phone it rises from the bottom edge, where a thumb reaches.

export function Modal({
  open,
  onClose,
  labelledBy,
  describedBy,
  className,
  children,
}: {
  open: boolean;
  /** Escape or a tap on the dimmed page behind. */
  onClose: () => void;
  labelledBy: string;
  describedBy?: string;
  className?: string;
  children: ReactNode;
}) {
  const ref = useRef<HTMLDialogElement>(null);

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      dialog.showModal();
      // showModal focuses the first control; React keeps autoFocus out of the DOM, so ask by mark.
      dialog.querySelector<HTMLElement>('[data-autofocus]')?.focus();
    }
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={labelledBy}
      aria-describedby={describedBy}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      onClick={(e) => {
        // Only the backdrop is the dialog element itself; the content fills the box.
        if (e.target === e.currentTarget) onClose();
      }}
      className={cn(
        'mx-auto mb-0 mt-auto w-full max-w-full rounded-t-2xl bg-white p-0 text-slate-900 shadow-xl backdrop:bg-slate-950/60 sm:mb-auto sm:max-w-md sm:rounded-2xl',
        className,
      )}
    >
      {open ? <div className="space-y-4 p-4 sm:p-5">{children}</div> : null}
    </dialog>
  );
}
