'use client';

import { useEffect, useRef } from 'react';
import { Button } from '@/components/ui/button';

/**
 * The end of a history list: older pages load by themselves when it scrolls into view (while
 * `auto`), or with the button (keyboard, or past the first few pages so that what sits below the
 * history stays within reach of a thumb).
 */
export function OlderEntries({ hasMore, hasItems, loading, auto, onMore }: { hasMore: boolean; hasItems: boolean; loading: boolean; auto: boolean; onMore: () => void }) {
  const sentinel = useRef<HTMLDivElement>(null);
  const more = useRef(onMore);
  useEffect(() => {
    more.current = onMore;
  });
  useEffect(() => {
    const el = sentinel.current;
    if (!el || !hasMore || !auto || loading || typeof IntersectionObserver === 'undefined') return;
    const observer = new IntersectionObserver(
      (seen) => {
        if (seen.some((s) => s.isIntersecting)) more.current();
      },
      { rootMargin: '200px 0px' },
    );
    observer.observe(el);
    return () => observer.disconnect();
  }, [hasMore, auto, loading]);
  return (
    <div ref={sentinel}>
      {hasMore ? (
        <Button variant="secondary" size="lg" className="w-full" onClick={onMore} disabled={loading}>
          {loading ? 'Loading older entries…' : 'Load older entries'}
        </Button>
      ) : hasItems ? (
        <p className="py-2 text-center text-sm text-slate-600">Start of the history.</p>
      ) : null}
    </div>
  );
}
