'use client';

import { useRouter } from 'next/navigation';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { LeaveDialogProps } from '@/components/ui/leave-dialog';
import { inAppPath } from '@/lib/ui/in-app-path';

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

/** The in-app path a plain click would follow, or null (modifier keys, new tab, download, another site). */
function followedPath(event: MouseEvent): string | null {
  if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return null;
  const anchor = event.target instanceof Element ? event.target.closest('a[href]') : null;
  if (!(anchor instanceof HTMLAnchorElement) || anchor.hasAttribute('download')) return null;
  return inAppPath(anchor.href, anchor.target, window.location.href);
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
      const href = followedPath(e);
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
