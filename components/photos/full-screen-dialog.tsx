'use client';

import { useEffect, useRef, type KeyboardEvent, type ReactNode } from 'react';
import { createPortal } from 'react-dom';

// A full-screen modal layer: focus moves in and stays in (Tab cycles), Escape closes, the page
// behind does not scroll, and focus returns to whatever opened it.

const focusable = 'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

export function FullScreenDialog({
  labelledBy,
  onClose,
  children,
  initialFocus,
}: {
  labelledBy: string;
  onClose: () => void;
  children: ReactNode;
  /** Selector inside the dialog to focus first; the first focusable element otherwise. */
  initialFocus?: string;
}) {
  const root = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const opener = document.activeElement as HTMLElement | null;
    const overflow = document.body.style.overflow;
    document.body.style.overflow = 'hidden';
    const first = (initialFocus && root.current?.querySelector<HTMLElement>(initialFocus)) || root.current?.querySelector<HTMLElement>(focusable);
    first?.focus();
    return () => {
      document.body.style.overflow = overflow;
      opener?.focus?.();
    };
    // Runs once per opening: focus must not jump while the dialog's content changes.
  }, []);

  function onKeyDown(e: KeyboardEvent<HTMLDivElement>) {
    if (e.key === 'Escape') {
      e.stopPropagation();
      onClose();
      return;
    }
    if (e.key !== 'Tab' || !root.current) return;
    const items = [...root.current.querySelectorAll<HTMLElement>(focusable)].filter((el) => el.offsetParent !== null || el === document.activeElement);
    if (items.length === 0) return;
    const first = items[0]!;
    const last = items[items.length - 1]!;
    if (e.shiftKey && document.activeElement === first) {
      e.preventDefault();
      last.focus();
    } else if (!e.shiftKey && document.activeElement === last) {
      e.preventDefault();
      first.focus();
    }
  }

  return createPortal(
    <div ref={root} role="dialog" aria-modal="true" aria-labelledby={labelledBy} onKeyDown={onKeyDown} className="fixed inset-0 z-50 flex flex-col bg-slate-950 text-white">
      {children}
    </div>,
    document.body,
  );
}
