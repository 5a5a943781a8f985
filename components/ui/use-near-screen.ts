'use client';

import { useEffect, useState } from 'react';

/**
 * True once the element is within a screen of the viewport, the page is about to print, or someone
 * moves with the Tab key (so keyboard focus never skips a part that is not there yet): for parts
 * below a phone's first screen whose script and data wait until someone heads towards them.
 */
export function useNearScreen<E extends Element = HTMLDivElement>(): [(el: E | null) => void, boolean] {
  const [el, setEl] = useState<E | null>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    if (!el || near) return;
    const show = () => setNear(true);
    const key = (e: KeyboardEvent) => e.key === 'Tab' && show();
    window.addEventListener('beforeprint', show);
    window.addEventListener('keydown', key);
    const stop = () => {
      window.removeEventListener('beforeprint', show);
      window.removeEventListener('keydown', key);
    };
    if (typeof IntersectionObserver === 'undefined') {
      show();
      return stop;
    }
    const io = new IntersectionObserver((seen) => seen.some((e) => e.isIntersecting) && show(), { rootMargin: '100% 0px' });
    io.observe(el);
    return () => {
      io.disconnect();
      stop();
    };
  }, [el, near]);
  return [setEl, near];
}
