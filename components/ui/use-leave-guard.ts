'use client';

import { useRouter } from 'next/navigation';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { LeaveDialogProps } from '@/components/ui/leave-dialog';

// Asks before work not yet sent is left behind: on reload or tab close (the browser's own
// question), on a link within the app, and on a form's own close button (`confirm`). Render
// <LeaveDialog {...guard.dialog} /> next to the form that uses it.

export interface LeaveGuard {
  /** Runs `leave` at once when nothing is at stake, otherwise after "Leave anyway". */
  confirm: (leave: () => void) => void;
  dialog: LeaveDialogProps;
}

export interface LeaveGuardOptions {
  /** Also guard reloads, tab close and in-app links (default). Off for a form whose page is guarded already. */
  pageLeave?: boolean;
}

/** The same-app address a click would follow, or null when the click is not a plain in-app navigation. */
export function inAppTarget(event: MouseEvent, origin: string, current: string): string | null {
  if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return null;
  const anchor = event.target instanceof Element ? event.target.closest('a[href]') : null;
  if (!(anchor instanceof HTMLAnchorElement) || anchor.hasAttribute('download')) return null;
  if (anchor.target && anchor.target !== '_self') return null;
  const url = new URL(anchor.href, current);
  if (url.origin !== origin) return null;
  const here = new URL(current);
  // A jump within the same page loses nothing.
  if (url.pathname === here.pathname && url.search === here.search && url.hash !== '') return null;
  return url.pathname + url.search + url.hash;
}

export function useLeaveGuard(blocking: boolean, message: string, { pageLeave = true }: LeaveGuardOptions = {}): LeaveGuard {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const onLeave = useRef<(() => void) | null>(null);
  const blockingRef = useRef(blocking);
  blockingRef.current = blocking;

  // Nothing left at stake (the upload finished, the item was removed): the question goes away.
  useEffect(() => {
    if (!blocking) setAsking(false);
  }, [blocking]);

  const confirm = useCallback((leave: () => void) => {
    if (!blockingRef.current) {
      leave();
      return;
    }
    onLeave.current = leave;
    setAsking(true);
  }, []);

  useEffect(() => {
    if (!blocking || !pageLeave) return;
    const beforeUnload = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      // Older browsers show their prompt only when returnValue is set.
      e.returnValue = '';
    };
    // Capture phase, ahead of the app's link handlers, which skip a click already prevented.
    const click = (e: MouseEvent) => {
      const href = inAppTarget(e, window.location.origin, window.location.href);
      if (!href) return;
      e.preventDefault();
      onLeave.current = () => router.push(href);
      setAsking(true);
    };
    window.addEventListener('beforeunload', beforeUnload);
    document.addEventListener('click', click, true);
    return () => {
      window.removeEventListener('beforeunload', beforeUnload);
      document.removeEventListener('click', click, true);
    };
  }, [blocking, pageLeave, router]);

  return {
    confirm,
    dialog: {
      open: asking,
      message,
      onStay: () => {
        onLeave.current = null;
        setAsking(false);
      },
      onLeave: () => {
        const leave = onLeave.current;
        onLeave.current = null;
        setAsking(false);
        leave?.();
      },
    },
  };
}
