'use client';

import { useEffect, useState } from 'react';

/**
 * True once the element is within a screen of the viewport, or the page is about to print: for
 * parts below a phone's first screen whose script and data wait until someone scrolls towards them.
 */
export function useNearScreen<E extends Element = HTMLDivElement>(): [(el: E | null) => void, boolean] {
  const [el, setEl] = useState<E | null>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    if (!el || near) return;
    const show = () => setNear(true);
    window.addEventListener('beforeprint', show);
    if (typeof IntersectionObserver === 'undefined') {
      show();
      return () => window.removeEventListener('beforeprint', show);
    }
    const io = new IntersectionObserver((seen) => seen.some((e) => e.isIntersecting) && show(), { rootMargin: '100% 0px' });
    io.observe(el);
    return () => {
      io.disconnect();
      window.removeEventListener('beforeprint', show);
    };
  }, [el, near]);
  return [setEl, near];
}
